# Invented journeys of an invented town's buses, drawn once with a fixed seed.
import csv, random
random.seed(7781)
rows = []
quarters = ["Q1", "Q2", "Q3", "Q4"]
for qi, qtr in enumerate(quarters):
    for _ in range(150):
        route = random.choices(["Red", "Green", "Blue"], weights=[45, 35, 20])[0]
        period = random.choice(["morning", "evening"])
        dist = round(random.uniform(2.0, 14.0), 1)
        stops = random.randint(4, 22)
        mins = 6 + 1.4 * dist + 0.35 * stops + (3 if period == "evening" else 0) + {"Red": 2, "Green": 0, "Blue": -1}[route] + random.gauss(0, 4)
        mins = round(max(5, mins), 1)
        late_p = 0.18 + (0.08 if route == "Red" else 0) - 0.03 * qi + (0.05 if period == "evening" else 0)
        on_time = "no" if random.random() < late_p else "yes"
        fare = random.choices(["card", "cash", "pass"], weights=[52, 18, 30])[0]
        rows.append([qtr, route, period, dist, stops, mins, on_time, fare])
with open("data/journeys.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["quarter", "route", "period", "distance_km", "stops", "minutes", "on_time", "fare"])
    w.writerows(rows)
