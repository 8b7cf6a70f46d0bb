# Invented household data for the Hearthlight Trust impact note (fixed seed).
import csv, random
rng = random.Random(90210)
regions = [("North Coast", 74), ("Uplands", 58), ("Riverside", 66), ("City", 55), ("Islands", 11)]
rows = []
i = 0
for region, count in regions:
    for _ in range(count):
        i += 1
        route = "Home visit" if rng.random() < 0.53 else "Phone"
        age = rng.choices(["Under 40", "40 to 64", "65 and over"], [28, 40, 32])[0]
        measures = min(5, max(0, round(rng.gauss(2.6 if route == "Home visit" else 1.9, 1.1))))
        base = 150 + 55 * measures + (40 if region == "Islands" else 0)
        saving = max(0, round(rng.gauss(base, 85)))
        p_warm = 0.62 + (0.04 if route == "Home visit" else 0.0) + (0.12 if age == "65 and over" else 0.0) - (0.08 if age == "Under 40" else 0.0)
        warmer = "yes" if rng.random() < p_warm else "no"
        rows.append({"household": f"HT-{i:04d}", "region": region, "route": route, "age_band": age,
                     "measures": measures, "saving": saving, "warmer": warmer})
rng.shuffle(rows)
with open("data/households.csv", "w", newline="") as f:
    w = csv.DictWriter(f, fieldnames=list(rows[0].keys()))
    w.writeheader()
    w.writerows(rows)
