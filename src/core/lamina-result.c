/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-calc-private.h"

#include <math.h>
#include <stdio.h>

G_DEFINE_BOXED_TYPE (LaminaResult, lamina_result, lamina_result_copy, lamina_result_free)

static void
warning_free (gpointer data)
{
  LaminaWarning *warning = data;

  g_free (warning->message);
  g_free (warning);
}

static gpointer
warning_copy (gconstpointer src,
              gpointer      user_data)
{
  const LaminaWarning *warning = src;
  LaminaWarning *copy = g_memdup2 (warning, sizeof *warning);

  copy->message = g_strdup (warning->message);
  return copy;
}

LaminaResult *
lamina_result_copy (const LaminaResult *result)
{
  LaminaResult *copy;

  g_return_val_if_fail (result != NULL, NULL);

  /* The layer results live in the same block, right after the struct. */
  copy = g_memdup2 (result, sizeof *result + sizeof (LaminaLayerResult) * result->n_layers);
  copy->layers = (LaminaLayerResult *) (copy + 1);
  copy->warnings = g_ptr_array_copy (result->warnings, warning_copy, NULL);
  g_ptr_array_set_free_func (copy->warnings, warning_free);
  return copy;
}

void
lamina_result_free (LaminaResult *result)
{
  if (result == NULL)
    return;
  g_ptr_array_unref (result->warnings);
  g_free (result);
}

gboolean
lamina_result_has_warning (const LaminaResult *result,
                           LaminaWarningKind   kind)
{
  for (guint i = 0; i < result->warnings->len; i++)
    if (((LaminaWarning *) result->warnings->pdata[i])->kind == kind)
      return TRUE;
  return FALSE;
}

gboolean
lamina_warning_kind_is_note (LaminaWarningKind kind)
{
  switch (kind)
    {
    case LAMINA_WARNING_LAYERS_DISREGARDED:
    case LAMINA_WARNING_CORRECTION_SMALL:
    case LAMINA_WARNING_FASTENER_LOW_CONDUCTIVITY:
    case LAMINA_WARNING_TAPERED:
    case LAMINA_WARNING_UNHEATED_SPACE:
      return TRUE;
    case LAMINA_WARNING_RATIO_OUT_OF_RANGE:
    case LAMINA_WARNING_METAL_BRIDGED_INSULATION:
    case LAMINA_WARNING_VENT_CLASS:
    case LAMINA_WARNING_TARGET_NOT_MET:
    default:
      return FALSE;
    }
}

LaminaResult *
lamina_result_new (guint n_layers)
{
  LaminaResult *result = g_malloc0 (sizeof *result + sizeof (LaminaLayerResult) * n_layers);

  result->n_layers = n_layers;
  result->layers = (LaminaLayerResult *) (result + 1);
  result->warnings = g_ptr_array_new_with_free_func (warning_free);
  return result;
}

double
lamina_round_significant (double value,
                          int    digits)
{
  double magnitude, factor;

  if (value == 0 || !isfinite (value))
    return value;
  magnitude = floor (log10 (fabs (value)));
  factor = pow (10.0, digits - 1 - magnitude);
  return round (value * factor) / factor;
}

const char *
lamina_format_u (char   *buffer,
                 double  u)
{
  double rounded;
  int decimals;

  if (!isfinite (u))
    {
      g_strlcpy (buffer, "\xe2\x80\x93", LAMINA_U_TEXT_SIZE); /* en dash: no value */
      return buffer;
    }
  if (u <= 0)
    decimals = 2, rounded = u;
  else
    {
      rounded = lamina_round_significant (u, 2);
      /* 0.095 → 3 decimals, 0.20 → 2, 1.2 → 1, 12 → 0. */
      decimals = CLAMP (1 - (int) floor (log10 (rounded)), 0, 6);
    }
  /* snprintf, not g_ascii_formatd: the reader's own decimal sign. */
  snprintf (buffer, LAMINA_U_TEXT_SIZE, "%.*f", decimals, rounded);
  return buffer;
}

const char *
lamina_format_u_against (char   *buffer,
                         double  u,
                         double  limit)
{
  int digits = 2;
  double rounded = u;

  if (!isfinite (u) || !isfinite (limit) || u <= 0 || u == limit)
    return lamina_format_u (buffer, u);
  for (; digits <= 6; digits++)
    {
      rounded = lamina_round_significant (u, digits);
      if ((u > limit) == (rounded > limit) && rounded != limit)
        break;
    }
  if (digits == 2)
    return lamina_format_u (buffer, u);
  digits = MIN (digits, 6);
  snprintf (buffer, LAMINA_U_TEXT_SIZE, "%.*f",
            CLAMP (digits - 1 - (int) floor (log10 (rounded)), 0, 8), rounded);
  return buffer;
}

/* Takes ownership of @message. */
void
lamina_result_add_warning (LaminaResult      *result,
                           LaminaWarningKind  kind,
                           int                layer,
                           char              *message)
{
  LaminaWarning *warning = g_new0 (LaminaWarning, 1);

  warning->kind = kind;
  warning->layer = layer;
  warning->message = message;
  g_ptr_array_add (result->warnings, warning);
}
