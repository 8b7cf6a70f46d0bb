# Invented repeat-prescription patients of three invented pharmacies, drawn once with a fixed seed.
import csv
import random

random.seed(8823)
branches = ["Elm Parade", "Fordham", "Wick Lane"]
ages = ["18-39", "40-64", "65+"]
months = ["Jan", "Feb", "Mar", "Apr", "May", "Jun"]
rows = []
k = 0
for branch in branches:
    for _ in range(140 if branch != "Wick Lane" else 90):
        k += 1
        age = random.choices(ages, weights=[22, 40, 38])[0]
        reminder = "text" if random.random() < (0.35 + (0.2 if age == "65+" else 0)) else "none"
        meds = random.randint(1, 7)
        for mi, month in enumerate(months):
            p = 0.66 + (0.04 * mi if reminder == "text" else 0.005 * mi) + (0.05 if age == "65+" else 0) - 0.01 * meds
            refilled = "yes" if random.random() < p else "no"
            late = 0 if refilled == "yes" else random.randint(1, 6 + meds)
            if month == "Jun":
                rows.append([f"R{k:04d}", branch, age, reminder, meds, month, refilled, late])
            else:
                rows.append([f"R{k:04d}", branch, age, reminder, meds, month, refilled, late])
with open("data/refills.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["patient", "branch", "age", "reminder", "medicines", "month", "refilled", "days_late"])
    out.writerows(rows)
