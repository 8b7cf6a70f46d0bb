#!/usr/bin/env python3
"""Writes the invented database of the library example: the loans of the
Linden Street Library, an invented lending library with three branches.
Every number comes from this script's fixed seed.

    python3 examples/library-db/make_data.py

It writes data/loans.db, a SQLite database with two tables, branches and
loans. The database is committed so that the example builds on a clean
clone; running the script again writes the same rows.
"""
import os
import random
import sqlite3

HERE = os.path.dirname(os.path.abspath(__file__))
PATH = os.path.join(HERE, "data", "loans.db")
rng = random.Random(20261014)

BRANCHES = [  # name, opened, loans per week, share of renewals
    ("Linden Street", 1968, 58, 0.31),
    ("Canal Quarter", 2009, 41, 0.24),
    ("Northfield", 1987, 27, 0.36),
]
ITEMS = [  # type, share of loans, mean loan in days
    ("book", 0.52, 19.0),
    ("audiobook", 0.14, 16.5),
    ("film", 0.15, 8.5),
    ("magazine", 0.11, 10.0),
    ("game", 0.08, 12.5),
]
QUARTERS = ["2026-Q2", "2026-Q3"]


def item_type():
    r = rng.random()
    for name, share, days in ITEMS:
        if r < share:
            return name, days
        r -= share
    return ITEMS[-1][0], ITEMS[-1][2]


def main():
    os.makedirs(os.path.dirname(PATH), exist_ok=True)
    if os.path.exists(PATH):
        os.remove(PATH)
    db = sqlite3.connect(PATH)
    db.execute("CREATE TABLE branches (branch TEXT PRIMARY KEY, opened INTEGER)")
    db.execute("""CREATE TABLE loans (
        loan_id INTEGER PRIMARY KEY,
        branch TEXT REFERENCES branches(branch),
        quarter TEXT,
        item_type TEXT,
        loan_days INTEGER,
        renewed TEXT,
        returned_late TEXT,
        reader_age INTEGER)""")
    db.executemany("INSERT INTO branches VALUES (?, ?)", [(b, o) for b, o, _, _ in BRANCHES])
    loan_id = 50000
    rows = []
    for quarter in QUARTERS:
        for branch, _, per_week, renew_share in BRANCHES:
            for _week in range(13):
                for _ in range(per_week + rng.randint(-6, 6)):
                    loan_id += 1
                    kind, mean_days = item_type()
                    renewed = "yes" if rng.random() < renew_share else "no"
                    days = max(1, round(rng.gauss(mean_days + (14 if renewed == "yes" else 0), 4.5)))
                    late = "yes" if rng.random() < (0.08 + 0.012 * max(0, days - 21)) else "no"
                    age = rng.choice([None] + [max(5, min(92, round(rng.gauss(41, 17))))] * 24)
                    rows.append((loan_id, branch, quarter, kind, days, renewed, late, age))
    db.executemany("INSERT INTO loans VALUES (?, ?, ?, ?, ?, ?, ?, ?)", rows)
    db.commit()
    db.execute("VACUUM")
    db.close()


if __name__ == "__main__":
    main()
