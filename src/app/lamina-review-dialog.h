/* SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

/* What the dialog asks to confirm. */
typedef enum
{
  LAMINA_REVIEW_DIALOG_APPROVE,   /* approve a checked revision */
  LAMINA_REVIEW_DIALOG_WITHDRAW,  /* withdraw an approval, with a reason */
  LAMINA_REVIEW_DIALOG_DELETE,    /* delete an approved construction */
} LaminaReviewDialogKind;

/* Called on @parent after the act was done (approve, withdraw) or
 * confirmed (delete: the caller deletes); @message is what to tell the
 * user. */
typedef void (*LaminaReviewDialogDone) (GtkWindow  *parent,
                                        const char *message);

#define LAMINA_TYPE_REVIEW_DIALOG (lamina_review_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaReviewDialog, lamina_review_dialog, LAMINA, REVIEW_DIALOG, GtkWindow)

/* Asks to confirm @kind for revision @revision of @id, naming it; the
 * library's rules apply on accepting and a refusal is shown in the
 * dialog, which stays open.  @reviewer is who acts. */
LaminaReviewDialog *lamina_review_dialog_present (GtkWindow              *parent,
                                                  LaminaLibrary          *library,
                                                  const char             *id,
                                                  int                     revision,
                                                  LaminaReviewDialogKind  kind,
                                                  const char             *reviewer,
                                                  LaminaReviewDialogDone  done);
/* The accept button: TRUE when the act was done (the dialog is gone). */
gboolean            lamina_review_dialog_accept  (LaminaReviewDialog *self);

G_END_DECLS
