/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Fuzz target: lamina_number_parse, the parser of every number a person
 * types into a field.  The first byte picks the field, the rest is the
 * text.  An accepted value is finite and inside the field's range and
 * reads back the same when printed; a refusal names the field and the
 * allowed range. */
#include "lamina-number.h"

#include <math.h>
#include <stdint.h>
#include <string.h>

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput (const uint8_t *data,
                        size_t         size)
{
  LaminaNumberField field;
  const LaminaNumberRange *range;
  g_autofree char *text = NULL;
  g_autofree char *range_text = NULL;
  g_autoptr(GError) error = NULL;
  double value = -12345.0;

  if (size == 0)
    return 0;
  field = (LaminaNumberField) (data[0] % LAMINA_N_FIELDS);
  range = lamina_number_field_get_range (field);
  text = g_strndup ((const char *) data + 1, size - 1);   /* stops at a NUL */
  range_text = lamina_number_dup_range_text (field);

  if (!lamina_number_parse (field, text, &value, &error))
    {
      g_assert (error != NULL);
      g_assert (value == -12345.0);
      g_assert (g_str_has_prefix (error->message, range->name));
      g_assert (strstr (error->message, range_text) != NULL);
      return 0;
    }
  g_assert (error == NULL);
  g_assert (isfinite (value));
  g_assert (range->open_min ? value > range->min : value >= range->min);
  g_assert (value <= range->max);
  {
    char printed[G_ASCII_DTOSTR_BUF_SIZE];
    double again = NAN;

    g_ascii_dtostr (printed, sizeof printed, value);
    g_assert (lamina_number_parse (field, printed, &again, NULL));
    g_assert (again == value);
  }
  return 0;
}
