/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-search.h: turning typed text into a search (private to
 * src/store and its tests). */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* A safe FTS5 query: every word of @text as a quoted prefix, all required;
 * NULL when @text has no word. */
char *lamina_library_text_to_fts_query (const char *text);

G_END_DECLS
