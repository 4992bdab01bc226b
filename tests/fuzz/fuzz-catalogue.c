/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Fuzz target: the catalogue XML reader and, for documents it accepts, the
 * writer and a second read (the round trip must succeed and agree). */
#include "lamina-catalogue.h"

#include <stdint.h>

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput (const uint8_t *data,
                        size_t         size)
{
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(LaminaCatalogue) again = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;
  gsize length = 0;

  catalogue = lamina_catalogue_read_memory ((const char *) data, size, "fuzz.xml", &error);
  if (catalogue == NULL)
    {
      /* Every refusal is located: it names the document. */
      g_assert (error != NULL && g_str_has_prefix (error->message, "fuzz.xml"));
      return 0;
    }
  text = lamina_catalogue_write_to_string (catalogue, LAMINA_WRITE_DERIVED, &length, &error);
  g_assert_no_error (error);
  again = lamina_catalogue_read_memory (text, length, "rewritten.xml", &error);
  if (again == NULL)
    g_error ("a written document was refused: %s", error->message);
  g_assert (again->constructions->len == catalogue->constructions->len);
  for (guint i = 0; i < catalogue->constructions->len; i++)
    g_assert (lamina_construction_equal_content (catalogue->constructions->pdata[i],
                                                 again->constructions->pdata[i]));
  return 0;
}
