#!/usr/bin/env python3
"""Writes the invented data of the bakery example (Fernhill Bakeries is an
invented chain; every number here comes from this script's fixed seed).

    python3 examples/bakery/make_data.py

The output is committed; running the script again gives the same bytes.
"""
import csv
import os
import random

HERE = os.path.dirname(os.path.abspath(__file__))
rng = random.Random(20261006)

STORES = {  # store: (mean basket in euro, share of app orders, daily orders)
    "Old Town": (14.2, 0.22, 9),
    "Riverside": (12.8, 0.35, 8),
    "Station Road": (9.6, 0.18, 10),
    "Hillcrest": (13.1, 0.28, 5),
}
MONTHS = ["2026-07", "2026-08", "2026-09"]


def orders():
    rows = []
    oid = 1000
    for month_i, month in enumerate(MONTHS):
        for store, (basket, app_share, per_day) in STORES.items():
            for day in range(1, 31):
                for _ in range(per_day + rng.randint(-2, 2)):
                    oid += 1
                    channel = "app" if rng.random() < app_share + 0.04 * month_i else "counter"
                    member = "yes" if rng.random() < (0.55 if channel == "app" else 0.3) else "no"
                    items = max(1, int(rng.gauss(3.2 if channel == "app" else 2.6, 1.3)))
                    spend = max(1.5, rng.gauss(basket * (1.1 if member == "yes" else 1.0) - 4.5, 2.6))
                    spend = round(spend + 1.7 * items, 2)
                    wait = max(0.5, rng.gauss(6.5 if store == "Station Road" else 4.5, 1.8))
                    returned = "yes" if rng.random() < (0.46 if member == "yes" else 0.31) else "no"
                    rating = min(5, max(1, int(round(rng.gauss(5.3 - 0.27 * wait, 0.75)))))
                    rows.append([oid, f"{month}-{day:02d}", month, store, channel, member,
                                 items, f"{spend:.2f}", f"{wait:.1f}", rating, returned])
    with open(os.path.join(HERE, "data", "orders.csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["order_id", "date", "month", "store", "channel", "member",
                    "items", "spend", "wait_minutes", "rating", "returned"])
        w.writerows(rows)


if __name__ == "__main__":
    orders()
