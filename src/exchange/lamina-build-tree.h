/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-build-tree.h: where a program run straight from the build folder
 * finds its translations and settings schema (an installed one uses the
 * install prefix). */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* TRUE when the running executable lies inside the build folder it was
 * built in. */
gboolean    lamina_running_from_build_tree (void);
/* The folder to bind the text domain to: the build folder's compiled
 * catalogues (<build>/po/LANG/LC_MESSAGES) from the build tree, the
 * install prefix's locale folder otherwise. */
const char *lamina_get_locale_dir          (void);
/* The build folder's compiled settings schemas, or NULL when installed. */
const char *lamina_get_build_schema_dir    (void);

G_END_DECLS
