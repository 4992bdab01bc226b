/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-row.h: one construction of the library list: office
 * code, name, element and thickness, corrected U and review status. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_LIBRARY_ROW (lamina_library_row_get_type ())
G_DECLARE_FINAL_TYPE (LaminaLibraryRow, lamina_library_row, LAMINA, LIBRARY_ROW, GtkBox)

GtkWidget *lamina_library_row_new         (void);
/* Shows @summary (and names it for assistive technology). */
void       lamina_library_row_set_summary (LaminaLibraryRow    *self,
                                           const LaminaSummary *summary);

G_END_DECLS
