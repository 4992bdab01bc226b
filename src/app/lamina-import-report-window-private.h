/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-import-report-window-private.h: the instance, for its own file
 * and for tests (the template's children, typed). */
#pragma once

#include "lamina-import-report-window.h"

G_BEGIN_DECLS

struct _LaminaImportReportWindow
{
  GtkWindow  parent_instance;

  /* template */
  GtkBox    *box;       /* the summary, then a line per item */
  GtkLabel  *summary;
};

G_END_DECLS
