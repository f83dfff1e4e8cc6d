#!/usr/bin/env python3
"""Writes the invented instrument-export shapes in this folder (not run by the build).

Every file holds runs of one invented polymer: first order, E = 150 kJ/mol, A = 1e12 1/s,
a 10.00 mg sample, char 0; some add 2 % water (first order, E = 50 kJ/mol, A = 1.2e5 1/s),
a buoyancy drift or noise, as stated per file. Integrated by RK4 on a 0.05 s grid. Seeded noise.
"""
import math, random

R = 8.314462618


def run(beta_k_min, t0_c=30.0, t1_c=600.0, dt=6.0, water=0.0, drift=0.0, noise_mg=0.0, seed=1):
    rnd = random.Random(seed)
    beta = beta_k_min / 60.0
    n = int((t1_c - t0_c) / beta / dt) + 1
    a = aw = 0.0
    rows = []
    h = 0.05 if beta_k_min > 5 else 0.2
    t = 0.0
    for i in range(n):
        target = i * dt
        while t < target - 1e-12:
            step = min(h, target - t)
            def f(tt, y):
                tk = t0_c + 273.15 + beta * tt
                k = 1e12 * math.exp(-150e3 / (R * tk))
                kw = 1.2e5 * math.exp(-50e3 / (R * tk))
                return (k * max(0.0, 1 - y[0]), kw * max(0.0, 1 - y[1]))
            y = (a, aw)
            k1 = f(t, y)
            k2 = f(t + step / 2, (y[0] + step / 2 * k1[0], y[1] + step / 2 * k1[1]))
            k3 = f(t + step / 2, (y[0] + step / 2 * k2[0], y[1] + step / 2 * k2[1]))
            k4 = f(t + step, (y[0] + step * k3[0], y[1] + step * k3[1]))
            a += step / 6 * (k1[0] + 2 * k2[0] + 2 * k3[0] + k4[0])
            aw += step / 6 * (k1[1] + 2 * k2[1] + 2 * k3[1] + k4[1])
            t += step
        tc = t0_c + beta * target
        m = 10.0 * (1 - water) * (1 - min(a, 1)) + 10.0 * water * (1 - min(aw, 1))
        m += 10.0 * drift * (tc - t0_c) / 500.0 + (noise_mg * rnd.gauss(0, 1) if noise_mg else 0)
        rows.append((target, tc, m))
    return rows


def write(name, text):
    with open(name, "w", encoding="utf-8", newline="") as f:
        f.write(text)


def dc(x, fmt):
    return (fmt % x).replace(".", ",")


# 1. metadata block (key: value), ';' separator, decimal commas
r = run(10, dt=6)
lines = ["Instrument: generic thermobalance", "Sample: invented polymer P-1", "Sample mass: 10,00 mg",
         "Heating rate: 10 K/min", "Atmosphere: nitrogen, 50 mL/min", "", "Time/min;Temperature/°C;Mass/mg"]
lines += ["%s;%s;%s" % (dc(t / 60, "%.4f"), dc(c, "%.3f"), dc(m, "%.5f")) for t, c, m in r]
write("metadata-block.csv", "\n".join(lines) + "\n")

# 2. units in a second header row, tab separated
r = run(5, dt=12)
lines = ["Time\tTemperature\tMass", "min\t°C\tmg"]
lines += ["%.4f\t%.3f\t%.5f" % (t / 60, c, m) for t, c, m in r]
write("unit-row.txt", "\n".join(lines) + "\n")

# 3. programme temperature beside the sample temperature, seconds, mass in %
r = run(20, dt=3)
lines = ["Time (s),Temperature program/°C,Sample temperature/°C,Mass/%"]
lines += ["%.1f,%.2f,%.3f,%.4f" % (t, c + 1.9, c, m * 10) for t, c, m in r]
write("two-temperatures.csv", "\n".join(lines) + "\n")

# 4. mass change in % from 0 to -100
r = run(10, dt=6)
lines = ["Time/min;Sample temperature/°C;Mass change/%"]
lines += ["%.4f;%.3f;%.4f" % (t / 60, c, (m - 10.0) * 10) for t, c, m in r]
write("mass-change-percent.csv", "\n".join(lines) + "\n")

# 5. mass loss in mg with the sample mass in the metadata
r = run(5, dt=12)
lines = ["Sample mass;8.50 mg", "Method;ramp 5 K/min to 600 °C", "", "Time/min;Temperature/°C;Mass loss/mg"]
lines += ["%.4f;%.3f;%.5f" % (t / 60, c, (10.0 - m) * 0.85) for t, c, m in r]
write("mass-loss-mg.csv", "\n".join(lines) + "\n")

# 6. hh:mm:ss time
r = run(2, dt=30)
lines = ["Time [hh:mm:ss],Temperature [°C],Weight [mg]"]
for t, c, m in r:
    s = int(round(t))
    lines.append("%02d:%02d:%02d,%.3f,%.5f" % (s // 3600, s // 60 % 60, s % 60, c, m))
write("hms-time.csv", "\n".join(lines) + "\n")

# 7. quoted decimal commas with a comma separator
r = run(10, dt=6)
lines = ['"Time (min)","Temperature (°C)","Mass (mg)"']
lines += ['"%s","%s","%s"' % (dc(t / 60, "%.4f"), dc(c, "%.3f"), dc(m, "%.5f")) for t, c, m in r]
write("quoted-decimal-comma.csv", "\n".join(lines) + "\n")

# 8. footer lines after the data
r = run(10, dt=6)
lines = ["time_min,temperature_C,mass_mg"]
lines += ["%.4f,%.3f,%.5f" % (t / 60, c, m) for t, c, m in r]
lines += ["", "End of data", "Residue at 600 °C: %.2f %%" % (r[-1][2] * 10), "Operator: --"]
write("footer.csv", "\n".join(lines) + "\n")

# 9. several ramps as blocks, each with a title and its own header; an initial hold block;
#    2 % water, a drift of +0.5 % over 500 K and 2 µg noise: the real-looking demo export
lines = ["Sample mass: 10.00 mg", "Atmosphere: nitrogen", "Crucible: alumina, open", ""]
lines += ["Segment 1: isothermal 30 °C, 5 min", "Time/min;Temperature/°C;Mass/mg"]
lines += ["%s;%s;%s" % (dc(i / 6, "%.4f"), dc(30.0, "%.3f"), dc(10.0, "%.5f")) for i in range(31)]
for k, b in enumerate([2, 5, 10, 20]):
    r = run(b, dt=max(1.5, 30.0 / b), water=0.02, drift=0.005, noise_mg=0.002, seed=10 + k)
    lines += ["", "Segment %d: ramp %d K/min to 600 °C" % (k + 2, b), "Time/min;Temperature/°C;Mass/mg"]
    lines += ["%s;%s;%s" % (dc(t / 60, "%.4f"), dc(c, "%.3f"), dc(m, "%.5f")) for t, c, m in r]
write("multi-ramp-blocks.csv", "\n".join(lines) + "\n")

# 10. one table, a segment column, time restarting in each segment; the last segment cools
lines = ["Segment;Time/min;Temperature/°C;Mass/%"]
for k, b in enumerate([2, 5, 10]):
    r = run(b, dt=30.0 / b)
    lines += ["%d;%.4f;%.3f;%.4f" % (k + 1, t / 60, c, m * 10) for t, c, m in r]
lines += ["4;%.4f;%.3f;%.4f" % (i / 2, 600 - 10 * i, 0.0) for i in range(30)]
write("segment-column.csv", "\n".join(lines) + "\n")

# 11. time rounded to 0.01 min at 0.5 s sampling: stamps repeat
r = run(20, dt=0.5, t1_c=450)
lines = ["Time/min,Sample temperature/°C,Mass/mg"]
lines += ["%.2f,%.3f,%.5f" % (t / 60, c, m) for t, c, m in r]
write("repeated-stamps.csv", "\n".join(lines) + "\n")
