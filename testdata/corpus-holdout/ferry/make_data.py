# Invented sailings of an invented ferry operator, drawn once with a fixed seed.
import csv
import random

random.seed(4101)
months = ["Jan", "Feb", "Mar", "Apr", "May", "Jun"]
weathers = ["calm", "breezy", "rough", "fog"]
rows = []
k = 0
for mi, month in enumerate(months):
    for route in ["North Sound", "Kelp Bay"]:
        for _ in range(48):
            k += 1
            w = random.choices(weathers, weights=[5, 4, 2, 1] if route == "North Sound" else [4, 4, 3, 1])[0]
            base = 3.0 + 0.4 * mi if route == "North Sound" else 8.0 - 0.7 * mi
            extra = {"calm": 0, "breezy": 1.5, "rough": 5, "fog": 7}[w]
            delay = max(0.0, random.gauss(base + extra, 3.0))
            delay = round(delay, 1)
            on_time = "yes" if delay <= 8 else "no"
            cap = 180 if route == "North Sound" else 120
            pax = max(5, min(cap, int(random.gauss(0.55 * cap + 6 * mi, 25))))
            rows.append([f"S{k:04d}", route, month, w, delay, on_time, pax])
with open("data/sailings.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["sailing", "route", "month", "weather", "delay", "on_time", "passengers"])
    out.writerows(rows)
