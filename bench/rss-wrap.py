#!/usr/bin/python3
"""Run a Python script as __main__ and record the process's peak RSS at exit.

    BENCH_RSS_FILE=/tmp/x.json /usr/bin/python3 bench/rss-wrap.py SCRIPT [ARGS...]

The Python twin of rss-preload.mjs, so the peer is measured the same way as the Node processes
(getrusage ru_maxrss of this process, KiB on Linux) without needing GNU time.
"""
import atexit
import json
import os
import resource
import runpy
import sys


def _record():
    out = os.environ.get("BENCH_RSS_FILE")
    if out:
        with open(out, "w") as f:
            ru = resource.getrusage(resource.RUSAGE_SELF)
            json.dump({"maxRssKiB": ru.ru_maxrss, "cpuS": ru.ru_utime + ru.ru_stime}, f)


atexit.register(_record)
script = sys.argv[1]
sys.argv = sys.argv[1:]
runpy.run_path(script, run_name="__main__")
