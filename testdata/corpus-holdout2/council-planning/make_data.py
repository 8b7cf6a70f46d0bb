# Invented data for the Northmere District Council planning report (fixed seed).
import csv, random
rng = random.Random(20260311)
wards = ["Abbeyfield", "Brookside", "Castlegate", "Dunmere", "Elm Vale", "Fenwick", "Greystone", "Hollins"]
ward_w = [18, 15, 14, 13, 12, 11, 9, 8]
types = [("Householder", 310, 48, 14, 0.86), ("Minor", 160, 62, 18, 0.74), ("Major", 42, 96, 30, 0.55)]
rows = []
n = 0
for t, count, mu, sd, p_in in types:
    for _ in range(count):
        n += 1
        team = rng.choice(["North", "South"])
        q = rng.choice(["Q1", "Q2", "Q3", "Q4"])
        qi = int(q[1])
        shift = (-2.5 * (qi - 1)) if team == "North" else (-0.6 * (qi - 1))
        days = max(12, round(rng.gauss(mu + shift, sd)))
        p = p_in + (0.03 * (qi - 1) if team == "North" else 0.0)
        in_time = "yes" if rng.random() < p else "no"
        ward = rng.choices(wards, ward_w)[0]
        rows.append({"app_id": f"NDC/25/{1000 + n:04d}", "type": t, "team": team, "quarter": q,
                     "ward": ward, "days": days, "in_time": in_time})
rng.shuffle(rows)
with open("data/applications.csv", "w", newline="") as f:
    w = csv.DictWriter(f, fieldnames=list(rows[0].keys()))
    w.writeheader()
    w.writerows(rows)
