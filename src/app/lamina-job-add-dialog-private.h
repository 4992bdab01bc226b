/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-add-dialog-private.h: the dialog's instance, for its own
 * file and for tests (the template children, typed). */
#pragma once

#include "lamina-job-add-dialog.h"

G_BEGIN_DECLS

struct _LaminaJobAddDialog
{
  GtkWindow        parent_instance;

  /* template */
  GtkDropDown     *use_dropdown;
  GtkSearchEntry  *search_entry;
  GtkCheckButton  *meets_check;
  GtkLabel        *filter_label;
  GtkListBox      *result_list;
  GtkEntry        *area_entry;
  GtkCheckButton  *variant_check;
  GtkLabel        *error_label;
  GtkDropDown     *revision_dropdown;
  GtkLabel        *revision_note;

  /* owned */
  LaminaLibrary   *library;
  LaminaJob       *job;
  LaminaTargetSet *targets;
  GStrv            uses;
  GPtrArray       *results;    /* LaminaSummary* */
  char            *chosen_id;  /* the construction the revisions are of */
  GArray          *revisions;  /* int, as listed in revision_dropdown */
  GArray          *approved;   /* gboolean, per revision listed */
};

G_END_DECLS
