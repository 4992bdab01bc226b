/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-window.h: the main window: the library list beside the editor. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-construction-list.h"
#include "lamina-editor.h"
#include "lamina-jobs-page.h"
#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_WINDOW (lamina_window_get_type ())
G_DECLARE_FINAL_TYPE (LaminaWindow, lamina_window, LAMINA, WINDOW, GtkApplicationWindow)

LaminaWindow           *lamina_window_new          (GtkApplication    *application,
                                                    LaminaLibrary     *library);
LaminaConstructionList *lamina_window_get_list     (LaminaWindow      *self);
LaminaEditor           *lamina_window_get_editor   (LaminaWindow      *self);
LaminaLibrary          *lamina_window_get_library  (LaminaWindow      *self);
/* The Jobs view, and switching views ("library", "jobs"). */
LaminaJobsPage         *lamina_window_get_jobs_page (LaminaWindow     *self);
void                    lamina_window_show_view    (LaminaWindow      *self,
                                                    const char        *name);
/* Opens construction @id in the editor (and selects its row). */
gboolean                lamina_window_open         (LaminaWindow      *self,
                                                    const char        *id,
                                                    GError           **error);
void                    lamina_window_set_search   (LaminaWindow      *self,
                                                    const char        *text);
/* Shows a short message at the bottom of the window. */
void                    lamina_window_notify       (LaminaWindow      *self,
                                                    const char        *message);
const char             *lamina_window_get_notice   (LaminaWindow      *self);
/* Writes the open construction's sheet to @path (what the export action
 * does after the file chooser). */
gboolean                lamina_window_export_sheet (LaminaWindow      *self,
                                                    const char        *path,
                                                    GError           **error);
gboolean                lamina_window_export_catalogue (LaminaWindow  *self,
                                                        const char    *path,
                                                        GError       **error);
/* Writes the open construction's section drawing to @path: SVG, or PNG
 * when @path ends in .png. */
gboolean                lamina_window_export_section (LaminaWindow    *self,
                                                      const char      *path,
                                                      GError         **error);
/* Prints the open construction's sheet through the print dialog, or to
 * the PDF @export_path without a dialog. */
gboolean                lamina_window_print        (LaminaWindow      *self,
                                                    const char        *export_path,
                                                    GError           **error);
/* The factor a sheet of @sheet_width × @sheet_height pt is printed at on
 * paper of @paper_width × @paper_height pt: 1 (full size, the stated
 * scale holds) whenever it fits, else the largest that fits, which the
 * printed page then states. */
double                  lamina_window_print_scale  (double             paper_width,
                                                    double             paper_height,
                                                    double             sheet_width,
                                                    double             sheet_height);

G_END_DECLS
