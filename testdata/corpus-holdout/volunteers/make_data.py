# Invented volunteers of an invented befriending network, drawn once with a fixed seed.
import csv
import random

random.seed(3318)
branches = {"Millbrook": 92, "Eastfield": 74, "Portway": 66, "Hollins": 18}
rows = []
k = 0
for branch, n in branches.items():
    for _ in range(n):
        k += 1
        tenure = round(random.uniform(0.2, 9.0), 1)
        trained = "yes" if random.random() < 0.55 else "no"
        hours = max(1, round(random.gauss(9 + 0.55 * tenure + (1.5 if trained == "yes" else 0), 3.6)))
        sat = max(1, min(10, round(3.2 + 0.33 * hours + random.gauss(0, 1.3))))
        p = 0.58 + (0.17 if trained == "yes" else 0) + (0.08 if branch == "Hollins" else 0)
        retained = "yes" if random.random() < p else "no"
        source = random.choices(["friend", "website", "event", "employer"], weights=[40, 30, 18, 12])[0]
        rows.append([f"V{k:03d}", branch, trained, tenure, hours, sat, retained, source])
with open("data/volunteers.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["volunteer", "branch", "trained", "tenure_years", "hours_month", "satisfaction", "retained", "source"])
    out.writerows(rows)
