/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-hardening-util.h: what the hardening tests and fuzz targets check
 * about a library file after something went wrong (a killed writer, a full
 * disk, a hostile document, a second process). */
#pragma once

#include <glib.h>

#include "lamina-library.h"

G_BEGIN_DECLS

/* PRAGMA integrity_check and foreign_key_check on @path through a raw
 * SQLite connection, then a full read through the store (open, every
 * construction's latest revision and history, every material).  FALSE
 * with a message naming what failed. */
gboolean  lamina_hardening_check_library (const char  *path,
                                          GError     **error);

/* A digest of everything a user would miss: every material, every live
 * construction's content at every revision, and the review data of each
 * revision.  Two libraries with the same digest hold the same work. */
char     *lamina_hardening_dup_state     (LaminaLibrary *library,
                                          GError       **error);
/* The same, opening @path (read only use). */
char     *lamina_hardening_dup_file_state (const char  *path,
                                           GError     **error);

/* A small timber-frame wall from the seeded materials; @n varies the
 * insulation thickness and the name so many differ. */
/* A new library @name in the test's data folder; @path (optional) gets
 * its file name. */
LaminaLibrary *lamina_hardening_open_library (const char *name,
                                              char      **path);
LaminaConstruction *lamina_hardening_make_wall (LaminaLibrary *library,
                                                guint          n);

/* Copies a closed library file over @to, removing @to's WAL and shared
 * memory files first. */
void      lamina_hardening_copy_library  (const char *from,
                                          const char *to);

G_END_DECLS
