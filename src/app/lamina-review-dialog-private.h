/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaReviewDialog's instance, for its tests. */
#pragma once

#include "lamina-review-dialog.h"

struct _LaminaReviewDialog
{
  GtkWindow               parent_instance;

  /* template */
  GtkLabel               *heading;
  GtkLabel               *body;
  GtkLabel               *reason_label;
  GtkEntry               *reason;
  GtkLabel               *error;
  GtkButton              *cancel;
  GtkButton              *accept;

  /* owned */
  LaminaLibrary          *library;
  char                   *id;
  char                   *reviewer;
  int                     revision;
  LaminaReviewDialogKind  kind;
  gboolean                reason_required;
  LaminaReviewDialogDone  done;
  GtkWindow              *parent;   /* not owned: the dialog is transient for it */
};
