# Invented records of an invented community orchard, drawn once with a fixed seed.
import csv, random
random.seed(4417)
rows = []
plots = ["Upper", "Lower", "Brook"]
for k in range(1, 361):
    plot = random.choices(plots, weights=[40, 35, 25])[0]
    variety = random.choice(["Russet", "Pippin", "Codlin"])
    band = random.choices(["1-5", "6-15", "16-40"], weights=[25, 45, 30])[0]
    pruned = "yes" if random.random() < 0.3 else "no"
    healthy = "yes" if random.random() < (0.86 if pruned == "yes" else 0.7) - (0.12 if band == "16-40" else 0) else "no"
    rain = round(random.uniform(420, 780))
    y = 8 + 0.025 * rain + (5 if pruned == "yes" else 0) + {"Upper": 2.5, "Lower": 0, "Brook": 1.2}[plot] + {"1-5": -6, "6-15": 2, "16-40": 0}[band] + random.gauss(0, 6.5)
    y = round(max(1.0, min(49.5, y)), 1)
    rows.append([f"T{k:03d}", plot, variety, band, pruned, healthy, rain, y])
with open("data/trees.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["tree", "plot", "variety", "age_band", "pruned", "healthy", "rain_mm", "yield_kg"])
    w.writerows(rows)
sess = []
months = ["May", "Jun", "Jul", "Aug", "Sep"]
for mi, m in enumerate(months):
    for site, n, base, slope in [("Hill", 40, 9.0, 1.1), ("Vale", 12, 8.0, 0.2)]:
        for _ in range(n):
            h = max(1, round(random.gauss(base + slope * mi - (1.5 if (site == "Vale" and m == "Jul") else 0), 2.2)))
            sess.append([m, site, h])
with open("data/sessions.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["month", "site", "helpers"])
    w.writerows(sess)
