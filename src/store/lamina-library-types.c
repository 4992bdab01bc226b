/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-types.c: the value types of lamina-library.h. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-library.h"
#include "lamina-library-backend.h"

#include <math.h>

G_DEFINE_QUARK (lamina-library-error-quark, lamina_library_error)

void
lamina_revision_info_free (LaminaRevisionInfo *info)
{
  if (info == NULL)
    return;
  g_free (info->modified_by);
  g_free (info->modified_at);
  g_free (info->checked_by);
  g_free (info->checked_at);
  g_free (info->approved_by);
  g_free (info->approved_at);
  g_free (info->comment);
  g_free (info);
}

void
lamina_material_change_free (LaminaMaterialChange *change)
{
  if (change == NULL)
    return;
  g_free (change->material_id);
  lamina_material_free (change->stored);
  lamina_material_free (change->library);
  g_free (change);
}

void
lamina_summary_free (LaminaSummary *summary)
{
  if (summary == NULL)
    return;
  g_free (summary->id);
  g_free (summary->code);
  g_free (summary->name);
  g_free (summary->modified_at);
  g_free (summary);
}

void
lamina_library_query_init (LaminaLibraryQuery *query)
{
  g_return_if_fail (query != NULL);

  *query = (LaminaLibraryQuery) {
    .text = NULL,
    .element = -1,
    .status = -1,
    .tag = NULL,
    .min_u = NAN,
    .max_u = NAN,
    .min_thickness = NAN,
    .max_thickness = NAN,
    .sort = LAMINA_SORT_CODE,
  };
}

static void
import_item_free (LaminaImportItem *item)
{
  g_free (item->id);
  g_free (item->name);
  g_free (item->message);
  g_free (item);
}

LaminaImportReport *
lamina_import_report_new (void)
{
  LaminaImportReport *report = g_new0 (LaminaImportReport, 1);

  report->items = g_ptr_array_new_with_free_func ((GDestroyNotify) import_item_free);
  return report;
}

void
lamina_import_report_add_item (LaminaImportReport *report,
                               LaminaImportAction  action,
                               gboolean            is_material,
                               const char         *id,
                               const char         *name,
                               int                 revision,
                               char               *message)
{
  LaminaImportItem *item = g_new0 (LaminaImportItem, 1);

  item->action = action;
  item->is_material = is_material;
  item->id = g_strdup (id);
  item->name = g_strdup (name);
  item->revision = revision;
  item->message = message;
  g_ptr_array_add (report->items, item);
}

void
lamina_import_report_free (LaminaImportReport *report)
{
  if (report == NULL)
    return;
  g_ptr_array_unref (report->items);
  g_free (report);
}
