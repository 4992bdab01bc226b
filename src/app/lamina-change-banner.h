/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-change-banner.h: the banner that says the construction open in
 * the editor was changed underneath by someone else (a newer revision, a
 * check, an approval or its withdrawal), with Reload and Keep editing.
 * The user's state on screen is never replaced without being asked; the
 * library's stale-save refusal still guards the next save. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-document.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_CHANGE_BANNER (lamina_change_banner_get_type ())
G_DECLARE_FINAL_TYPE (LaminaChangeBanner, lamina_change_banner, LAMINA, CHANGE_BANNER, GtkBox)

GtkWidget  *lamina_change_banner_new              (void);
/* The construction open now (NULL: none): what the library holds of it
 * becomes the state the banner compares with; the banner hides. */
void        lamina_change_banner_set_document     (LaminaChangeBanner *self,
                                                   LaminaDocument     *document);
/* After the library changed: @external when another process or
 * connection wrote (lamina_library_check_for_changes), else our own
 * write, which only moves the state compared with. */
void        lamina_change_banner_library_changed  (LaminaChangeBanner *self,
                                                   gboolean            external);
/* The message shown, or NULL while hidden. */
const char *lamina_change_banner_get_message      (LaminaChangeBanner *self);

G_END_DECLS
