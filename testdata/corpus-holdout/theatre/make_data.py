# Invented tickets and performances of an invented regional theatre, drawn once with a fixed seed.
import csv
import random

random.seed(7719)
types = ["full", "concession", "student", "member", "group", "under-16", "complimentary"]
tw = [38, 16, 10, 14, 9, 8, 5]
zones = {"stalls": 24, "circle": 19, "balcony": 13}
rows = []
for k in range(1, 901):
    t = random.choices(types, weights=tw)[0]
    zone = random.choices(list(zones), weights=[50, 30, 20])[0]
    channel = random.choices(["online", "box office", "phone"], weights=[60, 28, 12])[0]
    disc = {"full": 1, "concession": 0.8, "student": 0.6, "member": 0.85, "group": 0.75, "under-16": 0.5, "complimentary": 0}[t]
    price = round(zones[zone] * disc, 2)
    lead = int(min(90, max(0, random.expovariate(1 / (24 if channel == "online" else 11)))))
    p_show = {"online": 0.93, "box office": 0.97, "phone": 0.86}[channel] - (0.10 if t == "complimentary" else 0)
    attended = "yes" if random.random() < p_show else "no"
    rows.append([f"T{k:04d}", t, zone, channel, price, lead, attended])
with open("data/tickets.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["ticket", "type", "zone", "channel", "price", "days_ahead", "attended"])
    out.writerows(rows)
perf = []
for k in range(1, 37):
    spend = random.randint(300, 2400)
    sold = int(min(420, max(80, 150 + 0.09 * spend + random.gauss(0, 38))))
    perf.append([k, random.choice(["drama", "comedy", "music"]), spend, sold])
with open("data/performances.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["performance", "genre", "ad_spend", "seats_sold"])
    out.writerows(perf)
