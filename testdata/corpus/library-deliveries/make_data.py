# Invented home deliveries of an invented library, drawn once with a fixed seed.
import csv, random
random.seed(9123)
rows = []
weeks = list(range(1, 9))
for w in weeks:
    for _ in range(60):
        van = random.choice(["North", "South"])
        vol = "yes" if random.random() < 0.35 else "no"
        mins = round(max(8, random.gauss(34 + (6 if van == "South" else 0) - (3 if vol == "yes" else 0) - 0.4 * w, 9)), 1)
        on_time = "yes" if random.random() < (0.88 if vol == "yes" else 0.8) else "no"
        items = random.choices([1, 2, 3, 4, 5, 6], weights=[10, 25, 30, 20, 10, 5])[0]
        age = random.randint(62, 95)
        fmt = random.choices(["print", "audio", "large print"], weights=[50, 20, 30])[0]
        rows.append([w, van, vol, mins, on_time, items, age, fmt])
with open("data/deliveries.csv", "w", newline="") as f:
    wr = csv.writer(f)
    wr.writerow(["week", "van", "volunteer", "minutes", "on_time", "items", "age", "format"])
    wr.writerows(rows)
