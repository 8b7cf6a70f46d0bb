#!/usr/bin/env python3
"""Writes the invented data of the tutoring example: a pilot in which pupils
of three invented schools were assigned at random to small-group tutoring or
to the usual lessons. Every number comes from this script's fixed seed.

    python3 examples/tutoring/make_data.py
"""
import csv
import os
import random

HERE = os.path.dirname(os.path.abspath(__file__))
rng = random.Random(20260918)
SCHOOLS = ["Ashgrove", "Brookside", "Cedar Hill"]
WAVES = ["2026-01", "2026-03", "2026-06"]  # baseline, midterm, final test


def main():
    pupils, scores = [], []
    pid = 0
    for school in SCHOOLS:
        # Assignment by lot within each school: 35 places of each kind,
        # shuffled.
        arms = ["tutoring"] * 35 + ["usual"] * 35
        rng.shuffle(arms)
        for arm in arms:
            pid += 1
            ability = rng.gauss(52, 11)
            hours = round(max(0.0, rng.gauss(18, 6)), 1) if arm == "tutoring" else 0.0
            tests = []
            for w, _ in enumerate(WAVES):
                gain = 2.5 * w + (0.28 * hours * w / 2 if arm == "tutoring" else 0)
                tests.append(round(min(100, max(0, ability + gain + rng.gauss(0, 5))), 1))
            for wave, score in zip(WAVES, tests):
                scores.append([f"P{pid:03d}", school, arm, wave, score])
            passed = "yes" if tests[-1] >= 60 else "no"
            pupils.append([f"P{pid:03d}", school, arm, hours, tests[0], tests[-1],
                           round(tests[-1] - tests[0], 1), passed])
    with open(os.path.join(HERE, "data", "scores.csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["pupil", "school", "arm", "wave", "score"])
        w.writerows(scores)
    with open(os.path.join(HERE, "data", "pupils.csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["pupil", "school", "arm", "hours", "baseline", "final", "gain", "passed"])
        w.writerows(pupils)


if __name__ == "__main__":
    main()
