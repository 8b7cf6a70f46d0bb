# Invented school-canteen days of three invented schools, drawn once with a fixed seed.
import csv
import random

random.seed(2207)
schools = {"Ashgrove": 210, "Brookfield": 160, "Cedar Lane": 120}
menus = ["hot", "cold", "mixed"]
rows = []
for school, size in schools.items():
    for day in range(1, 41):
        menu = random.choice(menus)
        served = int(random.gauss(size, 18))
        effect = {"hot": 3.0, "cold": 0.5, "mixed": 1.6}[menu]
        waste = max(1.0, 1.5 + 0.052 * served + effect + random.gauss(0, 2.2))
        fruit = round(max(0.0, min(1.0, random.gauss(0.55 if menu != "cold" else 0.62, 0.1))) * 100)
        rows.append([school, day, menu, served, round(waste, 1), fruit])
with open("data/days.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["school", "day", "menu", "served", "waste_kg", "fruit_taken_pct"])
    out.writerows(rows)
