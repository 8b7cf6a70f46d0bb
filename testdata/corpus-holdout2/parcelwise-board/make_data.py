# Invented data for the Parcelwise board update (fixed seed).
import csv, random
rng = random.Random(1789)
# Trial-to-paid experiment: merchants randomly assigned to the old or the new onboarding flow.
rows = []
for i in range(1, 1201):
    variant = "Control" if rng.random() < 0.5 else "Guided setup"
    p = 0.17 if variant == "Control" else 0.26
    converted = "yes" if rng.random() < p else "no"
    revenue = round(max(0, rng.gauss(212, 70)), 2) if converted == "yes" else ""
    plan = rng.choices(["Starter", "Growth", "Pro", "Enterprise"], [46, 30, 17, 7])[0]
    rows.append({"merchant": f"M{50000 + i}", "variant": variant, "converted": converted,
                 "first_month_revenue": revenue, "plan": plan})
with open("data/trial.csv", "w", newline="") as f:
    w = csv.DictWriter(f, fieldnames=list(rows[0].keys()))
    w.writeheader()
    w.writerows(rows)
# Price test: three list prices, randomly assigned.
rows = []
for i in range(1, 901):
    price = rng.choice(["$29", "$39", "$49"])
    p = {"$29": 0.24, "$39": 0.21, "$49": 0.13}[price]
    rows.append({"visitor": f"V{i:05d}", "price": price, "signed_up": "yes" if rng.random() < p else "no"})
with open("data/pricing.csv", "w", newline="") as f:
    w = csv.DictWriter(f, fieldnames=list(rows[0].keys()))
    w.writeheader()
    w.writerows(rows)
# Weekly active merchants per region (12 weeks).
rows = []
for week in range(1, 13):
    for region, start, slope in [("US", 2050, 70.0), ("EU", 1900, 31.0)]:
        rows.append({"week": week, "region": region,
                     "active": round(start + slope * (week - 1) + rng.gauss(0, 45))})
with open("data/weekly.csv", "w", newline="") as f:
    w = csv.DictWriter(f, fieldnames=list(rows[0].keys()))
    w.writeheader()
    w.writerows(rows)
