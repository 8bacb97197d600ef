#!/usr/bin/env python3
"""Turns one run of the firmware cost bench into the cost tables.

    cost-table.py insns  STDOUT PLUGIN_LOG OUT_CSV
    cost-table.py size   NM_OUTPUT SIZE_OUTPUT SIZE_OUTPUT_WITHOUT_KERNEL [SIZE_OUTPUT_WITHOUT_BASELINE] OUT_CSV
    cost-table.py ratio  COST_CSV OUT_CSV
    cost-table.py readme COST_DIR README

insns: STDOUT is the bench's semihosting output (`function name=N calls=C`
lines, in the order of the marks, then `stack name=N bytes=B ...`);
PLUGIN_LOG holds the plugin's `MARK k insns=N` lines (tools/qemu-insn-count).
Marks come in pairs around each call; the first function is the calibration
(same call path, empty body), whose per-call count is subtracted.
Writes `function,calls,min_insns,median_insns,max_insns,stack_bytes`.

size: NM_OUTPUT is `llvm-nm -S -C --defined-only ELF`, SIZE_OUTPUT is
`llvm-size -A ELF`, SIZE_OUTPUT_WITHOUT_KERNEL the same for the bench built
without the kernel's functions. Writes
`component,code_bytes,table_bytes,static_ram_bytes`: `kernel` (the
difference between the two images: what the kernel's functions add, code,
tables and the library code they pull in), both images (code = vector table
+ .text; tables = .rodata + .data, the flash that holds constants and
initial values; RAM = .data + .bss), and per-symbol detail rows for the
crates of interest and the bench wrappers (with LTO, a function inlined into
a wrapper counts in the wrapper's row, and anonymous constants such as
table data count in no crate's row: use the `kernel` row). With
SIZE_OUTPUT_WITHOUT_BASELINE (the bench built without the f64 formulation
baseline) a `baseline` row gives the formulation's flash the same way.

ratio: pairs each baseline row `f64_NAME` of COST_CSV with the kernel row
`NAME` and writes `function,kernel_median_insns,baseline_median_insns,
median_ratio,kernel_max_insns,baseline_max_insns,worst_ratio,
kernel_stack_bytes,baseline_stack_bytes` (ratio = baseline / kernel; worst
= the two maxima over the same sweep of inputs).

readme: rewrites the section between `<!-- cost-table:begin -->` and
`<!-- cost-table:end -->` of README (appending a "Cost on Cortex-M cores"
section if there is none) from COST_DIR/<target>.csv, -size.csv and
-ratio.csv of the three cores, with the Cortex-M4F worst cases against the
project's targets. The figures in README are never typed by hand.
"""
import re
import statistics
import sys


def fail(message):
    print(f"cost-table: {message}", file=sys.stderr)
    sys.exit(1)


def fields(line):
    return dict(part.split("=", 1) for part in line.split()[1:] if "=" in part)


def insns(stdout_path, log_path, out_path):
    functions, stacks = [], {}
    with open(stdout_path) as f:
        for line in f:
            if line.startswith("function "):
                d = fields(line)
                functions.append((d["name"], int(d["calls"])))
            elif line.startswith("stack "):
                d = fields(line)
                stacks[d["name"]] = int(d["bytes"])
    marks = []
    with open(log_path) as f:
        for line in f:
            m = re.match(r"MARK (\d+) insns=(\d+)", line)
            if m:
                marks.append(int(m.group(2)))
    expected = 2 * sum(calls for _, calls in functions)
    if not functions or functions[0][0] != "calibration":
        fail("the bench output does not start with the calibration")
    if len(marks) != expected:
        fail(f"{len(marks)} marks in the plugin log, expected {expected}")
    deltas = [marks[i + 1] - marks[i] for i in range(0, len(marks), 2)]
    per_function, start = [], 0
    for name, calls in functions:
        per_function.append((name, deltas[start:start + calls]))
        start += calls
    calibration = per_function[0][1]
    if min(calibration) != max(calibration):
        fail(f"calibration is not repeatable: {sorted(set(calibration))}")
    overhead = calibration[0]
    with open(out_path, "w") as out:
        out.write("function,calls,min_insns,median_insns,max_insns,stack_bytes\n")
        for name, counts in per_function[1:]:
            net = [c - overhead for c in counts]
            if name not in stacks:
                fail(f"no stack line for {name}")
            out.write(f"{name},{len(net)},{min(net)},{statistics.median_low(net)},"
                      f"{max(net)},{stacks[name]}\n")
    print(f"calibration overhead {overhead} instructions per call subtracted")


# Symbol types from nm: code, read-only data (tables), RAM.
CODE, TABLES, RAM = set("tT"), set("rR"), set("dDbB")


def size(nm_path, size_path, size_without_kernel_path, *rest):
    *size_without_baseline_path, out_path = rest
    rows = {}

    def add(component, kind, nbytes):
        row = rows.setdefault(component, [0, 0, 0])
        row[kind] += nbytes

    with open(nm_path) as f:
        for line in f:
            parts = line.split(None, 3)
            if len(parts) != 4:
                continue
            _, size_hex, kind, name = parts
            nbytes = int(size_hex, 16)
            slot = 0 if kind in CODE else 1 if kind in TABLES else 2 if kind in RAM else None
            if slot is None:
                continue
            if "vapora_kernel::" in name:
                add("crate:vapora_kernel", slot, nbytes)
            elif "libm::" in name:
                add("crate:libm", slot, nbytes)
            elif "compiler_builtins::" in name:
                add("crate:compiler_builtins", slot, nbytes)
            m = re.search(r"vapora_firmware_example::measured::(call_\w+?)(::h[0-9a-f]+)?$",
                          name.strip())
            if m:
                add(f"wrapper:{m.group(1)}", slot, nbytes)
    full = image(size_path)
    without = image(size_without_kernel_path)
    rows["image"] = full
    rows["image-without-kernel"] = without
    rows["kernel"] = [a - b for a, b in zip(full, without)]
    if size_without_baseline_path:
        without_baseline = image(size_without_baseline_path[0])
        rows["image-without-baseline"] = without_baseline
        rows["baseline"] = [a - b for a, b in zip(full, without_baseline)]
    for name in ("crate:vapora_kernel", "crate:libm", "crate:compiler_builtins"):
        rows.setdefault(name, [0, 0, 0])
    order = lambda n: (0 if n == "kernel" else 1 if n == "baseline"
                       else 3 if n.startswith("image") else 2, n)
    with open(out_path, "w") as out:
        out.write("component,code_bytes,table_bytes,static_ram_bytes\n")
        for name in sorted(rows, key=order):
            code, tables, ram = rows[name]
            out.write(f"{name},{code},{tables},{ram}\n")


def image(size_path):
    """[code, tables, RAM] bytes of a linked image from `llvm-size -A`."""
    sections = {}
    with open(size_path) as f:
        for line in f:
            parts = line.split()
            if len(parts) == 3 and parts[0].startswith(".") and parts[1].isdigit():
                sections[parts[0]] = int(parts[1])
    if ".text" not in sections:
        fail(f"no .text section in {size_path}")
    s = lambda name: sections.get(name, 0)
    # .data occupies flash (its initial values) and RAM.
    return [s(".vector_table") + s(".text"), s(".rodata") + s(".data"), s(".data") + s(".bss")]


def read_cost(path):
    """{function: row dict} of a cost CSV, in file order."""
    with open(path) as f:
        lines = [line.strip().split(",") for line in f if line.strip()]
    header, body = lines[0], lines[1:]
    return {row[0]: dict(zip(header, row)) for row in body}


def ratio(cost_path, out_path):
    rows = read_cost(cost_path)
    pairs = [(name[len("f64_"):], name) for name in rows if name.startswith("f64_")]
    if not pairs:
        fail(f"no f64_ baseline rows in {cost_path}")
    with open(out_path, "w") as out:
        out.write("function,kernel_median_insns,baseline_median_insns,median_ratio,"
                  "kernel_max_insns,baseline_max_insns,worst_ratio,"
                  "kernel_stack_bytes,baseline_stack_bytes\n")
        for kernel_name, baseline_name in pairs:
            if kernel_name not in rows:
                fail(f"baseline {baseline_name} has no kernel row {kernel_name}")
            k, b = rows[kernel_name], rows[baseline_name]
            km, bm = int(k["median_insns"]), int(b["median_insns"])
            kx, bx = int(k["max_insns"]), int(b["max_insns"])
            out.write(f"{kernel_name},{km},{bm},{bm / km:.1f},{kx},{bx},{bx / kx:.1f},"
                      f"{k['stack_bytes']},{b['stack_bytes']}\n")


CORES = [
    ("thumbv6m-none-eabi", "Cortex-M0"),
    ("thumbv7m-none-eabi", "Cortex-M3"),
    ("thumbv7em-none-eabihf", "Cortex-M4F"),
]
BEGIN, END = "<!-- cost-table:begin -->", "<!-- cost-table:end -->"
# Cortex-M4F targets (worst case over the sweep): function, limit.
INSN_TARGETS = [
    ("saturation_temperature", "saturation temperature", 80),
    ("saturated_state_at_pressure", "full saturated state at p", 250),
    ("phase_from_pressure_enthalpy", "dryness fraction from (p, h)", 200),
]
STACK_TARGET_BYTES = 256
# Rows of the cost table that are not kernel functions.
NOT_KERNEL = ("f64_", "libm_", "horner")


def read_size(path):
    with open(path) as f:
        lines = [line.strip().split(",") for line in f if line.strip()]
    return {row[0]: [int(v) for v in row[1:]] for row in lines[1:]}


def readme(cost_dir, readme_path):
    costs, sizes, ratios = {}, {}, {}
    for target, _ in CORES:
        costs[target] = read_cost(f"{cost_dir}/{target}.csv")
        sizes[target] = read_size(f"{cost_dir}/{target}-size.csv")
        ratios[target] = read_cost(f"{cost_dir}/{target}-ratio.csv")
    m4f = CORES[-1][0]
    kernel_rows = [n for n in costs[m4f] if not n.startswith(NOT_KERNEL)]
    cores = " | ".join(name for _, name in CORES)
    lines = [
        BEGIN,
        "<!-- Generated by `python3 scripts/cost-table.py readme target/cost README.md` after",
        "`scripts/measure-cost.sh`; do not edit by hand. -->",
        "",
        "Measured by `scripts/measure-cost.sh` (run by `scripts/firmware-tests.sh` in CI):",
        "every public kernel function is called over a sweep of 128 inputs across its range",
        "(ending with the 623.15 K hand-over of IF97 and one input below and one above the",
        "range) on each emulated core, release build (`opt-level = 3`, fat LTO). Instruction",
        "counts are exact counts of instructions executed in QEMU, from the project's plugin",
        "(`tools/qemu-insn-count/`), **not cycles**: on silicon, divisions, square roots,",
        "soft-float library calls and flash wait states cost more than one cycle each. Each",
        "call includes building the kernel's unit type from a raw f32 (the range check a",
        "caller pays) and storing the whole result. Stack is the deepest point of the call,",
        "measured by painting the stack. Details: `firmware-example/README.md`.",
        "",
        "Instructions per call, min / median / max over the sweep (min is usually an",
        "out-of-range input rejected early), and stack bytes:",
        "",
        f"| function | {cores} |",
        "|---|" + "---|" * len(CORES),
    ]
    for name in kernel_rows:
        cells = []
        for target, _ in CORES:
            r = costs[target].get(name)
            cells.append("–" if r is None else
                         f"{r['min_insns']} / {r['median_insns']} / {r['max_insns']}, "
                         f"{r['stack_bytes']} B")
        lines.append(f"| `{name}` | " + " | ".join(cells) + " |")
    lines += [
        "",
        "Flash and static RAM, bytes: what the kernel's functions add to an image (the",
        "difference between the bench linked with and without them, including the library",
        "code only they pull in); the same for the f64 formulation baseline:",
        "",
        "| | " + cores + " |",
        "|---|" + "---|" * len(CORES),
    ]
    for label, row, column in [
        ("kernel code", "kernel", 0),
        ("kernel tables (constants in flash)", "kernel", 1),
        ("kernel static RAM", "kernel", 2),
        ("f64 formulation code", "baseline", 0),
        ("f64 formulation constants", "baseline", 1),
    ]:
        cells = [str(sizes[t].get(row, ["–"] * 3)[column]) for t, _ in CORES]
        lines.append(f"| {label} | " + " | ".join(cells) + " |")
    lines += [
        "",
        "The baseline a user would otherwise pick: the f64 IAPWS-IF97 formulation",
        "(`vapora-tables`, `no_std` + libm) compiled for the core and evaluated directly on",
        "the same inputs for the same outputs (Region 4 for saturation temperature and",
        "pressure; the saturated state from Regions 1 and 2, or the iterative Region 3",
        "solution above 623.15 K; dryness fraction by the lever rule on that state). Ratio",
        "of its instructions to the kernel's, at the median and in the worst case:",
        "",
        f"| function | {cores} |",
        "|---|" + "---|" * len(CORES),
    ]
    for name in ratios[m4f]:
        cells = []
        for target, _ in CORES:
            r = ratios[target].get(name)
            cells.append("–" if r is None else
                         f"{float(r['median_ratio']):.0f}× median, {float(r['worst_ratio']):.0f}× worst"
                         if float(r['median_ratio']) >= 10 else
                         f"{r['median_ratio']}× median, {r['worst_ratio']}× worst")
        lines.append(f"| `{name}` | " + " | ".join(cells) + " |")
    lines += [
        "",
        "Against the targets on the Cortex-M4F (worst case over the sweep):",
        "",
        "| target | measured | |",
        "|---|---|---|",
    ]
    for name, label, limit in INSN_TARGETS:
        worst = int(costs[m4f][name]["max_insns"])
        verdict = "met" if worst <= limit else f"**missed** by {worst - limit}"
        lines.append(f"| {label} (`{name}`) ≤ {limit} instructions | {worst} | {verdict} |")
    ram = sizes[m4f]["kernel"][2]
    lines.append(f"| kernel static RAM 0 bytes | {ram} | {'met' if ram == 0 else '**missed**'} |")
    deepest = max(kernel_rows, key=lambda n: int(costs[m4f][n]["stack_bytes"]))
    stack = int(costs[m4f][deepest]["stack_bytes"])
    verdict = "met" if stack <= STACK_TARGET_BYTES else "**missed**"
    lines.append(f"| stack ≤ {STACK_TARGET_BYTES} bytes for any call | {stack} (`{deepest}`) "
                 f"| {verdict} |")
    lines += [END]
    section = "\n".join(lines)
    with open(readme_path) as f:
        text = f.read()
    if BEGIN in text and END in text:
        head, rest = text.split(BEGIN, 1)
        _, tail = rest.split(END, 1)
        text = head + section + tail
    else:
        text = text.rstrip("\n") + "\n\n## Cost on Cortex-M cores\n\n" + section + "\n"
    with open(readme_path, "w") as f:
        f.write(text)


if __name__ == "__main__":
    arguments = {"insns": (3,), "size": (4, 5), "ratio": (2,), "readme": (2,)}
    if len(sys.argv) < 2 or len(sys.argv) - 2 not in arguments.get(sys.argv[1], ()):
        fail(__doc__)
    {"insns": insns, "size": size, "ratio": ratio, "readme": readme}[sys.argv[1]](*sys.argv[2:])
