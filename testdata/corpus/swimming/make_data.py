# Invented swimming-lesson records of an invented leisure centre, drawn once with a fixed seed.
import csv, random
random.seed(5150)
rows = []
terms = ["Autumn", "Spring", "Summer"]
for ti, term in enumerate(terms):
    for _ in range(140):
        inst = random.choices(["Ana", "Ben", "Cal"], weights=[40, 35, 25])[0]
        age = random.randint(5, 13)
        band = "5-7" if age <= 7 else ("8-10" if age <= 10 else "11-13")
        pool = random.choice(["Main", "Learner"])
        lessons = random.randint(1, 16)
        lengths = max(0, round(random.gauss(2 + 0.9 * lessons + 0.6 * (age - 5), 3)))
        p = 0.45 + 0.03 * lessons + {"Ana": 0.05, "Ben": 0.0, "Cal": -0.08}[inst] + (0.06 * ti if pool == "Main" else 0.01 * ti)
        passed = "yes" if random.random() < min(0.95, p) else "no"
        rows.append([term, inst, age, band, pool, lessons, lengths, passed])
with open("data/swimmers.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["term", "instructor", "age", "age_group", "pool", "lessons", "lengths", "passed"])
    w.writerows(rows)
