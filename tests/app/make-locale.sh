#!/bin/sh
# SPDX-License-Identifier: GPL-3.0-or-later
# Compiles the da_DK.UTF-8 locale into the build dir (used through LOCPATH)
# so the Danish test needs no root.  On failure it leaves an empty folder
# and the test skips.
out=$1
mkdir -p "$out"
localedef -i da_DK -f UTF-8 "$out/da_DK.UTF-8" 2>/dev/null || true
touch "$out/.stamp"
