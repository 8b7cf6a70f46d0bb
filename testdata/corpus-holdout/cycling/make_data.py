# Invented daily counts at two invented cycle-lane counters, drawn once with a fixed seed.
import csv
import random

random.seed(6604)
months = ["Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec", "Jan", "Feb", "Mar"]
temps = [10, 13, 16, 18, 18, 15, 11, 7, 5, 4, 5, 7]
rows = []
for mi, month in enumerate(months):
    for site in ["Mill Road", "Quay Street"]:
        for d in range(30):
            t = round(random.gauss(temps[mi], 3.0), 1)
            rain = round(max(0.0, random.expovariate(1 / 2.2) - 0.8), 1)
            weekend = "weekend" if d % 7 in (5, 6) else "weekday"
            growth = 1 + (0.045 * mi if site == "Mill Road" else 0.004 * mi)
            base = (520 if site == "Mill Road" else 410) * growth
            riders = int(max(40, base + 14 * (t - 10) - 22 * rain - (90 if weekend == "weekend" else 0) + random.gauss(0, 55)))
            rows.append([month, site, d + 1, weekend, t, rain, riders])
with open("data/counts.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["month", "site", "day", "daytype", "temp_c", "rain_mm", "riders"])
    out.writerows(rows)
