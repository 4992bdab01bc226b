#!/bin/sh
# SPDX-License-Identifier: GPL-3.0-or-later
# Runs a window test under its own X server; skips cleanly (TAP) when
# xvfb-run is not installed.
if ! command -v xvfb-run >/dev/null 2>&1; then
  echo "1..0 # SKIP xvfb-run is not installed"
  exit 0
fi
exec xvfb-run -a -s "-screen 0 1280x800x24" "$@"
