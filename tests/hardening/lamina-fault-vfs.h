/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-fault-vfs.h: an SQLite VFS for tests that wraps the default one
 * and injects faults at the file level, without any hook in src/store:
 * - a crash: the process _exit()s just before its k-th write-like call
 *   (xWrite, xTruncate, xSync on any file: the library, its WAL, a
 *   journal, a backup), as if killed by SIGKILL at that point;
 * - a full disk: once a budget of bytes by which files may grow is used
 *   up, a growing xWrite fails with SQLITE_FULL (ENOSPC).
 * Installed as the default VFS, so the store's sqlite3_open_v2 uses it. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

#define LAMINA_FAULT_EXIT_STATUS 86

void   lamina_fault_vfs_install        (void);
/* 0 = never.  Counting restarts at the call. */
void   lamina_fault_vfs_set_exit_after (guint64 k);
/* -1 = unlimited. */
void   lamina_fault_vfs_set_free_bytes (gint64  bytes);
/* Write-like calls since the last set_exit_after (or install). */
guint64 lamina_fault_vfs_get_count     (void);

G_END_DECLS
