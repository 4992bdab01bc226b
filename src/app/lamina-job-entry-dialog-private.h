/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-entry-dialog-private.h: the dialog's instance, for its own
 * file and for tests (the template children, typed). */
#pragma once

#include "lamina-job-entry-dialog.h"

G_BEGIN_DECLS

struct _LaminaJobEntryDialog
{
  GtkWindow      parent_instance;

  /* template */
  GtkLabel      *title_label;
  GtkDropDown   *revision_dropdown;
  GtkDropDown   *use_dropdown;
  GtkEntry      *location_entry;
  GtkEntry      *area_entry;
  GtkLabel      *error_label;
  GtkButton     *save_button;

  /* owned */
  LaminaLibrary *library;
  LaminaJob     *job;
  int            n;
  GArray        *revisions;   /* int, in the dropdown's order */
  GStrv          uses;        /* in the dropdown's order */
};

G_END_DECLS
