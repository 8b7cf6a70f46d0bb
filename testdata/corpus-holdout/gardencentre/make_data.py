# Invented trading days and baskets of an invented garden-centre chain, drawn once with a fixed seed.
import csv
import random

random.seed(1450)
stores = {"Ashby Road": ("north", 400), "Bramley": ("north", 320), "Coldharbour": ("south", 480),
          "Dunmore": ("south", 350), "Eastwick": ("south", 270)}
months = ["Mar", "Apr", "May"]
days = []
for mi, month in enumerate(months):
    for d in range(1, 27):
        for store, (region, foot) in stores.items():
            promo = "yes" if random.random() < 0.2 else "no"
            season = 1 + (0.22 * mi if region == "south" else 0.04 * mi)
            footfall = int(random.gauss(foot * season * (1.08 if promo == "yes" else 1.0), 45))
            sales = round(footfall * random.gauss(21.0, 2.2) / 1000, 2)
            days.append([month, d, store, region, promo, footfall, sales])
with open("data/days.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["month", "day", "store", "region", "promo", "footfall", "sales_k"])
    out.writerows(days)
depts = ["plants", "tools", "cafe", "furniture", "pets", "gifts"]
baskets = []
for k in range(1, 601):
    d = random.choices(depts, weights=[34, 14, 22, 7, 12, 11])[0]
    loyal = "member" if random.random() < 0.4 else "non-member"
    base = {"plants": 24, "tools": 31, "cafe": 9, "furniture": 140, "pets": 18, "gifts": 15}[d]
    value = round(max(2.0, random.gauss(base * (1.1 if loyal == "member" else 1.0), base * 0.35)), 2)
    baskets.append([f"B{k:04d}", d, loyal, value])
with open("data/baskets.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["basket", "department", "loyalty", "value"])
    out.writerows(baskets)
