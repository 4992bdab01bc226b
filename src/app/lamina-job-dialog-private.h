/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-dialog-private.h: the dialog's instance, for its own file
 * and for tests (the template children, typed). */
#pragma once

#include "lamina-job-dialog.h"

G_BEGIN_DECLS

struct _LaminaJobDialog
{
  GtkWindow      parent_instance;

  /* template */
  GtkEntry      *id_entry;
  GtkEntry      *name_entry;
  GtkEntry      *number_entry;
  GtkEntry      *client_entry;
  GtkEntry      *site_entry;
  GtkEntry      *architect_entry;
  GtkDropDown   *status_dropdown;
  GtkEntry      *inside_entry;
  GtkEntry      *outside_entry;
  GtkDropDown   *climate_dropdown;
  GtkEntry      *ground_area_entry;
  GtkEntry      *ground_perimeter_entry;
  GtkEntry      *ground_b_prime_entry;
  GtkDropDown   *targets_dropdown;
  GtkLabel      *error_label;
  GtkButton     *save_button;

  /* owned */
  LaminaLibrary *library;
  LaminaJob     *job;           /* what is edited; a fresh one for a new job */
  gboolean       is_new;
  GStrv          climate_ids;   /* [0] "" = none, then the library's */
  GStrv          set_ids;       /* [0] "" = none, then the library's */
};

G_END_DECLS
