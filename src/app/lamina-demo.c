/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-demo.c: the invented practice's demo library, shipped in the
 * resources. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-demo.h"

#include "exchange/lamina-catalogue.h"

gboolean
lamina_demo_load (LaminaLibrary  *library,
                  GError        **error)
{
  g_autoptr(GBytes) bytes = NULL;
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(LaminaImportReport) report = NULL;
  gsize size = 0;
  const char *data;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), FALSE);

  bytes = g_resources_lookup_data ("/org/example/Lamina/demo/lamina-demo.xml", 0, error);
  if (bytes == NULL)
    return FALSE;
  data = g_bytes_get_data (bytes, &size);
  catalogue = lamina_catalogue_read_memory (data, size, "lamina-demo.xml", error);
  if (catalogue == NULL)
    return FALSE;
  /* The invented practice's own library: its review state is its own. */
  report = lamina_library_import (library, catalogue, LAMINA_IMPORT_KEEP_REVIEW, NULL, error);
  return report != NULL;
}
