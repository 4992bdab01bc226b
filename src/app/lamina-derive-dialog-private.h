/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-derive-dialog-private.h: the dialog's instance, for its own file
 * and for tests (the template children, typed). */
#pragma once

#include "lamina-derive-dialog.h"

G_BEGIN_DECLS

struct _LaminaDeriveDialog
{
  GtkWindow         parent_instance;

  /* template */
  GtkLabel         *intro;
  GtkCheckButton   *description;
  GtkCheckButton   *notes;
  GtkLabel         *tags_heading;
  GtkFlowBox       *tag_box;
  GtkButton        *derive_button;

  /* owned */
  GtkWindow        *parent;
  LaminaLibrary    *library;
  char             *id;
  char             *author;
  GPtrArray        *tags;         /* char*, the construction's tags */
  GPtrArray        *tag_checks;   /* GtkCheckButton*, borrowed: one per tag, same order */
  LaminaDeriveDone  done;
};

G_END_DECLS
