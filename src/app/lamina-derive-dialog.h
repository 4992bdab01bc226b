/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-derive-dialog.h: "Derive for a New Job" asks what to keep. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-construction.h"
#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_DERIVE_DIALOG (lamina_derive_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaDeriveDialog, lamina_derive_dialog, LAMINA, DERIVE_DIALOG, GtkWindow)

/* Called with the id of the new draft, or NULL and an error. */
typedef void (*LaminaDeriveDone) (GtkWindow   *parent,
                                  const char  *id,
                                  GError      *error);

/* Asks which of @c's description, notes and tags the copy for the new
 * job keeps (by default: no description, no notes, every tag), then
 * derives it in @library. */
LaminaDeriveDialog *lamina_derive_dialog_present (GtkWindow                *parent,
                                                  LaminaLibrary            *library,
                                                  const LaminaConstruction *c,
                                                  const char               *author,
                                                  LaminaDeriveDone          done);

G_END_DECLS
