/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-junction-dialog-private.h: the dialog's instance, for its
 * own file and for tests (the template children, typed). */
#pragma once

#include "lamina-job-junction-dialog.h"

G_BEGIN_DECLS

struct _LaminaJobJunctionDialog
{
  GtkWindow      parent_instance;

  /* template */
  GtkEntry      *name_entry;
  GtkEntry      *psi_entry;
  GtkEntry      *length_entry;
  GtkLabel      *error_label;
  GtkButton     *save_button;

  /* owned */
  LaminaLibrary *library;
  LaminaJob     *job;
  int            n;            /* 0: a new junction */
};

G_END_DECLS
