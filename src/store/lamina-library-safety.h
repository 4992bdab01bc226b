/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-safety.h: what keeps an office's library safe.
 *
 * Read-only libraries.  A library whose file or folder cannot be written
 * (or opened with LAMINA_LIBRARY_OPEN_READ_ONLY) opens read-only: every
 * reading call works, every write is refused with
 * LAMINA_LIBRARY_ERROR_READ_ONLY and one message ("office.sqlite: the
 * library is read-only (the folder cannot be written); nothing was
 * changed").
 *
 * A busy library.  A write waits while another program holds the
 * library's write lock (a long import), up to the busy timeout, calling
 * the wait function so that a terminal or a window can say so; then it
 * fails with LAMINA_LIBRARY_ERROR_BUSY naming the holder where the
 * system tells it.
 *
 * Verification and backups: lamina_library_verify, the rolling copies
 * (lamina_library_backup_daily) and their restoration. */
#pragma once

#include <gio/gio.h>

#include "lamina-library.h"

G_BEGIN_DECLS

gboolean       lamina_library_is_read_only         (LaminaLibrary *self);
/* Why the library is read-only ("the file is read-only"), or NULL. */
const char    *lamina_library_get_read_only_reason (LaminaLibrary *self);
/* TRUE if writable; else FALSE with the READ_ONLY error every refused
 * write gets (for a caller that refuses before it starts). */
gboolean       lamina_library_check_writable       (LaminaLibrary  *self,
                                                    GError        **error);

/* Called when a write starts waiting for another program's lock, with
 * @holder naming it if known ("lamina-cli import, process 4242, user
 * anna") or NULL, and again with @waiting FALSE when the wait ends. */
typedef void (*LaminaLibraryWaitFunc) (LaminaLibrary *library,
                                       gboolean       waiting,
                                       const char    *holder,
                                       gpointer       user_data);

void           lamina_library_set_wait_func     (LaminaLibrary        *self,
                                                 LaminaLibraryWaitFunc func,
                                                 gpointer              user_data);
/* Seconds a write waits for another program's lock before it fails with
 * BUSY.  Default: LAMINA_BUSY_TIMEOUT from the environment, else 60. */
void           lamina_library_set_busy_timeout  (LaminaLibrary        *self,
                                                 double                seconds);
double         lamina_library_get_busy_timeout  (LaminaLibrary        *self);
/* Waits until a write could start now (no other program holds the write
 * lock), holding the lock itself for no longer than a moment and writing
 * nothing; looks at @cancellable about once a second and calls the wait
 * function as a write would.  @seconds > 0: gives up after that long with
 * the BUSY error that names the holder; 0: no limit.  TRUE at once for a
 * library without a library-wide write lock (a server). */
gboolean       lamina_library_wait_until_writable (LaminaLibrary      *self,
                                                   double              seconds,
                                                   GCancellable       *cancellable,
                                                   GError            **error);

G_END_DECLS

G_BEGIN_DECLS

/* ---- Verification ------------------------------------------------------ */

typedef struct
{
  gboolean   storage_checked;  /* FALSE: the backend has no storage check */
  guint      n_constructions;
  guint      n_approved;       /* approved revisions recalculated */
  guint      n_reviews;        /* review records looked at */
  GPtrArray *problems;         /* char*, one sentence each; empty = sound */
} LaminaVerifyReport;

void                lamina_verify_report_free (LaminaVerifyReport *report);
/* The storage's own check (SQLite: PRAGMA integrity_check and the
 * foreign keys) and Lamina's: every approved revision of every live
 * construction recalculated from its stored build-up and compared with
 * the figures stored at approval, and the review records checked against
 * the revisions (approved ones name a checker and an approver, no
 * approval dated before its revision's modification, four-eyes approvals
 * not by the author, records of existing revisions only).  NULL with an
 * error only when the check could not run at all. */
LaminaVerifyReport *lamina_library_verify     (LaminaLibrary      *self,
                                               GError            **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaVerifyReport, lamina_verify_report_free)

G_END_DECLS

G_BEGIN_DECLS

/* ---- Rolling backups ----------------------------------------------------
 *
 * Copies of the library made with the storage's online backup (SQLite:
 * sqlite3_backup_*, consistent while others write), named
 * NAME-YYYYMMDD-HHMMSS.sqlite after the library's NAME.sqlite, in the
 * backup folder: LAMINA_BACKUP_DIR from the environment, else the
 * library's setting "backup-folder" (relative to the library's folder),
 * else NAME.sqlite.backups beside the library, else (that folder cannot be
 * made) lamina/backups/NAME-HASH in the user's data folder.  The window
 * and lamina-cli make the day's copy when they first open the library on
 * a day (local time) and keep the newest "backup-keep" (default 14;
 * 0 = no copies). */
#define LAMINA_BACKUP_KEEP_DEFAULT 14

char          *lamina_library_dup_backup_dir   (LaminaLibrary  *self);
/* The same without the library's setting (a library that cannot be
 * opened): the environment's folder, or the default. */
char          *lamina_backup_dup_dir_for_path  (const char     *library_path);
guint          lamina_library_get_backup_keep  (LaminaLibrary  *self);
/* @folder NULL leaves it, "" returns to the default; @keep < 0 leaves it. */
gboolean       lamina_library_set_backup_settings (LaminaLibrary *self,
                                                   const char    *folder,
                                                   int            keep,
                                                   GError       **error);
/* A copy now, then all but the newest "backup-keep" dropped; returns its
 * path. */
char          *lamina_library_backup_now       (LaminaLibrary  *self,
                                                GError        **error);
/* The day's copy: made and returned if there is none from today, else
 * NULL without an error (also for a read-only library or keep 0). */
char          *lamina_library_backup_daily     (LaminaLibrary  *self,
                                                GError        **error);
/* The copies of the library at @library_path in @dir (NULL: the folder
 * the environment or the default names), newest first (char*). */
GPtrArray     *lamina_backup_list              (const char     *library_path,
                                                const char     *dir);
/* Brings @backup back as the library at @library_path, which need not
 * exist or may be damaged: @backup is checked first (a Lamina library,
 * sound); the current file, if any, is kept as
 * NAME-YYYYMMDD-HHMMSS-before-restore.sqlite in @dir (NULL: as for
 * lamina_backup_list), its path in *@kept. */
gboolean       lamina_library_restore_backup   (const char     *library_path,
                                                const char     *backup,
                                                const char     *dir,
                                                char          **kept,
                                                GError        **error);

G_END_DECLS
