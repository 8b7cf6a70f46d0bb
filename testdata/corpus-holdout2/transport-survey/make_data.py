# Invented passenger survey data for the Corrin Valley Transport Authority (fixed seed).
import csv, random
rng = random.Random(8086)
routes = {"Bus": ["Route 7", "Route 12", "Route 31", "Route 44"], "Tram": ["Line T1", "Line T2"], "Rail": ["Valley Line"]}
rows = []
i = 0
for w, (wave, count) in enumerate([("Spring 2025", 230), ("Autumn 2025", 240), ("Spring 2026", 250)]):
    for _ in range(count):
        i += 1
        mode = rng.choices(["Bus", "Tram", "Rail"], [55, 28, 17])[0]
        route = rng.choice(routes[mode])
        age = rng.choices(["16-24", "25-44", "45-64", "65+"], [2.2, 38, 34, 25.8])[0]
        wait = max(1, round(rng.gauss({"Bus": 11, "Tram": 7, "Rail": 14}[mode], 4.5), 1))
        trend = {"Bus": 0.35, "Tram": -0.05, "Rail": 0.2}[mode] * w
        sat = round(min(10, max(0, rng.gauss(7.6 - 0.11 * wait + trend + {"16-24": -0.4, "25-44": 0, "45-64": 0.1, "65+": 0.5}[age], 1.7))))
        rec = "yes" if rng.random() < 0.2 + 0.07 * sat else "no"
        rows.append({"response": f"CV{i:04d}", "wave": wave, "mode": mode, "route": route, "age_band": age,
                     "wait": wait, "satisfaction": sat, "recommend": rec})
rng.shuffle(rows)
with open("data/responses.csv", "w", newline="") as f:
    wtr = csv.DictWriter(f, fieldnames=list(rows[0].keys()))
    wtr.writeheader()
    wtr.writerows(rows)
