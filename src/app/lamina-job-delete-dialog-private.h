/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-delete-dialog-private.h: the dialog's instance, for its own
 * file and for tests (the template children, typed). */
#pragma once

#include "lamina-job-delete-dialog.h"

G_BEGIN_DECLS

struct _LaminaJobDeleteDialog
{
  GtkWindow      parent_instance;

  /* template */
  GtkLabel      *question_label;
  GtkLabel      *detail_label;
  GtkBox        *key_box;
  GtkLabel      *key_label;
  GtkEntry      *key_entry;
  GtkLabel      *error_label;
  GtkButton     *delete_button;

  /* owned */
  LaminaLibrary *library;
  LaminaJob     *job;
};

G_END_DECLS
