# Invented exit-survey answers of an invented county museum, drawn once with a fixed seed.
import csv
import random

random.seed(2961)
months = ["Jan", "Feb", "Mar", "Apr"]
rows = []
k = 0
for mi, month in enumerate(months):
    for _ in range(110):
        k += 1
        group = random.choices(["adult", "family", "school"], weights=[50, 35, 15])[0]
        guide = "yes" if random.random() < (0.3 if group != "school" else 0.1) else "no"
        minutes = int(max(20, random.gauss({"adult": 95, "family": 80, "school": 70}[group] + (18 if guide == "yes" else 0), 22)))
        rating = max(1, min(5, round(random.gauss(3.7 + (0.35 if guide == "yes" else 0) + (0.06 * mi if guide == "yes" else 0), 0.8))))
        spend = round(max(0.0, random.gauss(0.09 * minutes + (4 if group == "family" else 0) - 3, 3.5)), 2)
        bought = "yes" if spend >= 5 else "no"
        age = random.randint(18, 80) if group == "adult" else random.randint(28, 55)
        rows.append([f"M{k:04d}", month, group, guide, minutes, rating, spend, bought, age])
with open("data/visitors.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["visitor", "month", "group", "audio_guide", "minutes", "rating", "shop_spend", "bought", "age"])
    out.writerows(rows)
