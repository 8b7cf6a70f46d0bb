# Invented parking sessions from an invented town's pay-by-app pilot, drawn once with a fixed seed.
import csv
import random

random.seed(5530)
zones = {"Harbour": "pilot", "Station": "pilot", "Old Town": "meters", "Riverside": "meters"}
rows = []
k = 0
for week in range(1, 11):
    for zone, group in zones.items():
        for _ in range(random.randint(36, 44)):
            k += 1
            if group == "pilot":
                w = [40 + 3 * week, 30, 12, 8]
            else:
                w = [6, 46, 30, 10]
            channel = random.choices(["app", "card", "coins", "phone"], weights=w)[0]
            minutes = int(max(10, random.gauss(95 if zone != "Station" else 150, 40)))
            p_over = 0.16 if group == "meters" else max(0.05, 0.17 - 0.011 * week)
            overstay = "yes" if random.random() < p_over else "no"
            fee = round(minutes / 60 * (1.8 if zone in ("Harbour", "Old Town") else 1.4), 2)
            rows.append([f"P{k:05d}", week, zone, group, channel, minutes, overstay, fee])
with open("data/sessions.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["session", "week", "zone", "scheme", "channel", "minutes", "overstay", "fee"])
    out.writerows(rows)
