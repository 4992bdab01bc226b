#!/usr/bin/env python3
# SPDX-License-Identifier: GPL-3.0-or-later
# Window figures of build-aux/bench (run under Xvfb): start-up to the first
# frame on 10,000 constructions, resident memory on 100,000.
#   bench-window.py LAMINA_EXE CACHE_DIR RUNS
import glob, json, os, shutil, statistics, subprocess, sys, tempfile, time

exe, cache, runs = sys.argv[1], sys.argv[2], max(3, int(sys.argv[3]))


def top_windows():
    out = subprocess.run(['xwininfo', '-root', '-children'], capture_output=True, text=True).stdout
    return {line.split()[0] for line in out.splitlines() if line.strip().startswith('0x')}


def viewable(window):
    out = subprocess.run(['xwininfo', '-id', window], capture_output=True, text=True).stdout
    return 'IsViewable' in out


def launch(library):
    """(ms to the first frame or to the viewable window, how, VmRSS MB)."""
    tmp = tempfile.mkdtemp(prefix='lamina-bench-window-')
    copy = os.path.join(tmp, 'library.sqlite')
    shutil.copy(library, copy)  # the app may migrate it: never touch the cache
    env = dict(os.environ, LAMINA_BENCH_FIRST_FRAME='1', XDG_CONFIG_HOME=tmp, XDG_DATA_HOME=tmp)
    before = top_windows()
    t0 = time.monotonic()
    proc = subprocess.Popen([exe, '--library', copy], env=env, text=True,
                            stdout=subprocess.PIPE, stderr=subprocess.DEVNULL)
    shown = None
    try:
        while shown is None and time.monotonic() - t0 < 60 and proc.poll() is None:
            if any(viewable(w) for w in top_windows() - before):
                shown = (time.monotonic() - t0) * 1e3
            else:
                time.sleep(0.005)
        if shown is None:
            raise RuntimeError(f"no window within 60 s (exit status {proc.poll()})")
        time.sleep(2)
        with open(f'/proc/{proc.pid}/status') as status:
            rss = next(float(l.split()[1]) / 1024 for l in status if l.startswith('VmRSS:'))
    finally:
        proc.terminate()
        out = proc.communicate(timeout=30)[0]
        shutil.rmtree(tmp)
    for line in out.splitlines():
        if line.startswith('lamina-first-frame-monotonic-us: '):
            return (int(line.split(': ')[1]) / 1e6 - t0) * 1e3, 'first frame', rss
    return shown, 'window viewable (no first-frame hook)', rss


def report(name, unit, values, target, note):
    value = statistics.median(values)
    spread = max(values) - min(values)
    verdict = 'met' if value <= target else 'MISSED'
    print(f'{name:<40} {value:11.4g} {unit:<8} ±{spread / 2:<9.3g} {"":37} target ≤{target:g}  {verdict}'
          f'  ({note}, wall)')
    print('JSON ' + json.dumps(dict(name=name, value=value, unit=unit, floor=None, ratio=None, spread=spread,
                                    target=target, met=value <= target, runs=len(values), clock='wall',
                                    note=note)), flush=True)


for size, name, unit, target, pick in ((10000, 'app.first_frame.n10000', 'ms', 400, 0),
                                       (100000, 'app.resident_memory.n100000', 'MB', 200, 2)):
    found = sorted(glob.glob(os.path.join(cache, f'bench-library-*-n{size}-seed*.sqlite')))
    if not found:
        print(f'{name:<40} skipped: no synthetic library of {size} (bench-store builds it)', flush=True)
        continue
    try:
        samples = [launch(found[-1]) for _ in range(runs)]
    except (OSError, RuntimeError, subprocess.SubprocessError) as e:
        print(f'{name:<40} skipped: {e}', flush=True)
        continue
    note = samples[0][1] if pick == 0 else 'VmRSS 2 s after the window is shown'
    report(name, unit, [s[pick] for s in samples], target, note)
