# Invented donations to an invented community fridge, drawn once with a fixed seed.
import csv, random
random.seed(3303)
rows = []
months = ["Jan", "Feb", "Mar", "Apr", "May", "Jun"]
for mi, m in enumerate(months):
    for _ in range(80):
        donor = random.choices(["shop", "household", "cafe", "farm"], weights=[45, 30, 15, 10])[0]
        daytype = "weekend" if random.random() < 0.3 else "weekday"
        slot = random.choices(["morning", "afternoon", "evening"], weights=[40, 35, 25])[0]
        temp = round(random.uniform(2, 12) + 2.2 * mi, 1)
        kg = round(max(0.5, random.gauss(5 + (1.2 if daytype == "weekend" else 0) + (0.8 if m == "Mar" else 0) - 0.15 * mi, 1.6)), 1)
        wasted = round(max(0, random.gauss(0.05 * kg * temp / 4, 0.6)), 2)
        p = {"morning": 0.9, "afternoon": 0.82, "evening": 0.72}[slot]
        collected = "yes" if random.random() < p else "no"
        cat = random.choices(["bakery", "fruit", "dairy"], weights=[40, 35, 25])[0]
        rows.append([m, donor, daytype, slot, temp, kg, wasted, collected, cat])
with open("data/donations.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["month", "donor", "daytype", "slot", "temp_c", "kg", "wasted_kg", "collected", "category"])
    w.writerows(rows)
