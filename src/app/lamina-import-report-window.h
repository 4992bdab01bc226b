/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-import-report-window.h: what an import did, in the window's
 * words: the summary line, then one line per construction or material,
 * conflicts marked. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_IMPORT_REPORT_WINDOW (lamina_import_report_window_get_type ())
G_DECLARE_FINAL_TYPE (LaminaImportReportWindow, lamina_import_report_window, LAMINA, IMPORT_REPORT_WINDOW,
                      GtkWindow)

LaminaImportReportWindow *lamina_import_report_window_new (GtkWindow                *parent,
                                                           const LaminaImportReport *report);

G_END_DECLS
