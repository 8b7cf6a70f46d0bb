# Invented sales of an invented ferry café, drawn once with a fixed seed.
import csv, random
random.seed(8123)
rows = []
for week in range(1, 7):
    for _ in range(90):
        crossing = random.choices(["morning", "midday", "evening"], weights=[40, 35, 25])[0]
        weather = "rainy" if random.random() < 0.4 else "sunny"
        item = random.choices(["coffee", "tea", "cake", "sandwich", "soup"], weights=[38, 20, 17, 15, 10])[0]
        spend = round(max(1.2, random.gauss({"morning": 4.1, "midday": 6.3, "evening": 5.2}[crossing] + (0.6 if weather == "rainy" else 0), 1.5)), 2)
        cake = "yes" if random.random() < (0.32 if weather == "rainy" else 0.22) else "no"
        wait = round(max(0.5, random.gauss(3 + 0.25 * week, 1.2)), 1)
        rows.append([week, crossing, weather, item, spend, cake, wait])
with open("data/sales.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["week", "crossing", "weather", "item", "spend", "bought_cake", "wait_min"])
    w.writerows(rows)
