# Invented applicant data for the Whitlow University admissions summary (fixed seed).
import csv, random
rng = random.Random(5150)
rows = []
i = 0
for cycle, count in [(2024, 820), (2025, 860), (2026, 910)]:
    for _ in range(count):
        i += 1
        school = rng.choices(["State", "Grammar", "Independent", "Overseas"], [58, 14, 16, 12])[0]
        fee = "Overseas" if school == "Overseas" else "Home"
        faculty = rng.choices(["Arts", "Science", "Engineering", "Business"], [27, 30, 18, 25])[0]
        tariff = min(200, max(80, round(rng.gauss({"State": 128, "Grammar": 146, "Independent": 150, "Overseas": 136}[school], 20))))
        p_offer = 0.45 + (tariff - 130) * 0.012 + (0.04 * (cycle - 2024) if fee == "Home" else -0.05 * (cycle - 2024))
        p_offer += {"Arts": 0.05, "Science": 0.0, "Engineering": -0.12, "Business": 0.03}[faculty]
        offer = "yes" if rng.random() < min(0.97, max(0.03, p_offer)) else "no"
        mark = ""
        if offer == "yes" and cycle == 2025 and rng.random() < 0.55:
            mark = round(min(92, max(28, rng.gauss(22 + 0.31 * tariff, 7.5))), 1)
        rows.append({"applicant": f"WU{cycle}-{i:05d}", "cycle": cycle, "school_type": school, "fee_status": fee,
                     "faculty": faculty, "tariff": tariff, "offer": offer, "first_year_mark": mark})
rng.shuffle(rows)
with open("data/applicants.csv", "w", newline="") as f:
    w = csv.DictWriter(f, fieldnames=list(rows[0].keys()))
    w.writeheader()
    w.writerows(rows)
