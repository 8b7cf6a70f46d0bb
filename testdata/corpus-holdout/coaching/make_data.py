# Invented calls of an invented call centre's randomized coaching trial, drawn once with a fixed seed.
import csv
import random

random.seed(9132)
reasons = ["billing", "delivery", "returns", "account", "technical"]
agents = []
for a in range(1, 61):
    arm = "coached" if a % 2 == 0 else "usual"
    tenure = random.randint(2, 60)
    agents.append((f"A{a:02d}", arm, tenure))
random.shuffle(agents)
calls = []
people = []
k = 0
for agent, arm, tenure in agents:
    skill = random.gauss(0, 1) + 0.01 * tenure
    before = None
    for week in range(1, 9):
        gain = 0.035 * (week - 1) if arm == "coached" else 0.006 * (week - 1)
        for _ in range(5):
            k += 1
            reason = random.choices(reasons, weights=[30, 25, 18, 15, 12])[0]
            p = min(0.95, max(0.2, 0.62 + 0.04 * skill + gain))
            resolved = "yes" if random.random() < p else "no"
            handle = max(2.0, random.gauss(9.5 - 0.3 * skill - (0.9 if arm == "coached" and week > 2 else 0), 2.6))
            calls.append([f"C{k:05d}", agent, arm, week, reason, round(handle, 1), resolved])
    score = round(60 + 8 * skill + random.gauss(0, 6))
    people.append([agent, arm, tenure, score])
with open("data/calls.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["call", "agent", "arm", "week", "reason", "handle_min", "resolved"])
    out.writerows(calls)
with open("data/agents.csv", "w", newline="") as f:
    out = csv.writer(f)
    out.writerow(["agent", "arm", "tenure_months", "quality_score"])
    out.writerows(people)
