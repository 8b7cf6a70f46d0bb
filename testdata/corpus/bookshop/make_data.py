# Invented orders of an invented online bookshop, drawn once with a fixed seed.
import csv, random
random.seed(6061)
rows = []
months = ["Jan", "Feb", "Mar", "Apr", "May", "Jun"]
for mi, m in enumerate(months):
    for _ in range(100):
        channel = random.choices(["web", "app", "phone"], weights=[50, 35, 15])[0]
        cust = "repeat" if random.random() < 0.22 else "new"
        band = random.choices(["18-29", "30-49", "50+"], weights=[30, 45, 25])[0]
        items = random.randint(1, 8)
        value = round(max(4, 6 + 7.5 * items + (5 if cust == "repeat" else 0) + random.gauss(0, 6)), 2)
        days = max(1, min(10, round(random.gauss(3.2, 1.8))))
        cancel = "yes" if random.random() < {"web": 0.06, "app": 0.05, "phone": 0.14}[channel] else "no"
        rating = max(1, min(10, round(random.gauss(7.2 + (0.15 * mi if cust == "repeat" else -0.05 * mi), 1.4))))
        rows.append([m, channel, cust, band, items, value, days, cancel, rating])
with open("data/orders.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["month", "channel", "customer", "age_band", "items", "value", "delivery_days", "cancelled", "rating"])
    w.writerows(rows)
