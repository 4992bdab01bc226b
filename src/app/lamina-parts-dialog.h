/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-parts-dialog.h: the parts of a bridged layer (infill, studs,
 * noggings…): material or air, fraction or width at spacing, member name,
 * which part takes the remainder.  Every change is a pure edit applied to
 * the document at once (so it joins the document's undo history); the
 * core's validation message is shown beside the part it concerns. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-document.h"

G_BEGIN_DECLS

/* Layer @index of @document; modal over @parent (may be NULL). */
GtkWindow *lamina_parts_dialog_present   (GtkWindow      *parent,
                                          LaminaDocument *document,
                                          guint           index);
/* For tests: a widget of part @part ("material", "mode", "fraction",
 * "width", "spacing", "member", "remove", "error"), or with @part
 * G_MAXUINT one of the layer's ("add", "layer-error"). */
GtkWidget *lamina_parts_dialog_get_field (GtkWindow    *dialog,
                                          guint         part,
                                          const char   *name);

G_END_DECLS
