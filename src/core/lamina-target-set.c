/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-target-set.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "lamina-error.h"
#include "lamina-record-private.h"

static const char *const moisture_names[] = {
  "none", "no-condensation", "no-accumulation",
};
G_STATIC_ASSERT (G_N_ELEMENTS (moisture_names) == LAMINA_N_MOISTURE_CRITERIA);

G_DEFINE_BOXED_TYPE (LaminaTargetSet, lamina_target_set,
                     lamina_target_set_copy, lamina_target_set_free)

const char *
lamina_moisture_criterion_to_string (LaminaMoistureCriterion value)
{
  g_return_val_if_fail ((guint) value < LAMINA_N_MOISTURE_CRITERIA, NULL);
  return moisture_names[value];
}

gboolean
lamina_moisture_criterion_from_string (const char              *name,
                                       LaminaMoistureCriterion *value)
{
  for (guint i = 0; name != NULL && i < G_N_ELEMENTS (moisture_names); i++)
    if (strcmp (moisture_names[i], name) == 0)
      {
        *value = (LaminaMoistureCriterion) i;
        return TRUE;
      }
  return FALSE;
}

gboolean
lamina_identifier_is_valid (const char *text)
{
  gsize length;

  if (text == NULL)
    return FALSE;
  length = strlen (text);
  if (length == 0 || length > 200 || !g_utf8_validate (text, -1, NULL))
    return FALSE;
  for (const char *p = text; *p != '\0'; p = g_utf8_next_char (p))
    if (g_unichar_isspace (g_utf8_get_char (p)))
      return FALSE;
  return TRUE;
}

LaminaTarget *
lamina_target_new (const char *use,
                   double      max_u)
{
  LaminaTarget *target = g_new0 (LaminaTarget, 1);

  target->use = g_strdup (use);
  target->element = -1;
  target->max_u = max_u;
  target->min_frsi = NAN;
  return target;
}

LaminaTarget *
lamina_target_copy (const LaminaTarget *target)
{
  LaminaTarget *copy = g_memdup2 (target, sizeof *target);

  copy->use = g_strdup (target->use);
  copy->label = g_strdup (target->label);
  return copy;
}

void
lamina_target_free (LaminaTarget *target)
{
  if (target == NULL)
    return;
  g_free (target->use);
  g_free (target->label);
  g_free (target);
}

LaminaTargetSet *
lamina_target_set_new (const char *id,
                       const char *name)
{
  LaminaTargetSet *set = g_new0 (LaminaTargetSet, 1);

  set->id = g_strdup (id);
  set->name = g_strdup (name);
  set->targets = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_target_free);
  return set;
}

LaminaTargetSet *
lamina_target_set_copy (const LaminaTargetSet *set)
{
  LaminaTargetSet *copy = lamina_target_set_new (set->id, set->name);

  copy->source = g_strdup (set->source);
  copy->notes = g_strdup (set->notes);
  copy->line = set->line;
  for (guint i = 0; i < set->targets->len; i++)
    lamina_target_set_add (copy, lamina_target_copy (g_ptr_array_index (set->targets, i)));
  return copy;
}

void
lamina_target_set_free (LaminaTargetSet *set)
{
  if (set == NULL)
    return;
  g_free (set->id);
  g_free (set->name);
  g_free (set->source);
  g_free (set->notes);
  g_ptr_array_unref (set->targets);
  g_free (set);
}

void
lamina_target_set_add (LaminaTargetSet *set,
                       LaminaTarget    *target)
{
  g_return_if_fail (set != NULL && target != NULL);
  g_ptr_array_add (set->targets, target);
}

const LaminaTarget *
lamina_target_set_find (const LaminaTargetSet *set,
                        const char            *use)
{
  g_return_val_if_fail (set != NULL, NULL);

  for (guint i = 0; use != NULL && i < set->targets->len; i++)
    {
      const LaminaTarget *target = g_ptr_array_index (set->targets, i);

      if (g_strcmp0 (target->use, use) == 0)
        return target;
    }
  return NULL;
}

static gboolean
target_equal (const LaminaTarget *a,
              const LaminaTarget *b)
{
  return g_strcmp0 (a->use, b->use) == 0
         && g_strcmp0 (a->label, b->label) == 0
         && a->element == b->element
         && lamina_same_number (a->max_u, b->max_u)
         && lamina_same_number (a->min_frsi, b->min_frsi)
         && a->moisture == b->moisture
         && a->ground == b->ground;
}

gboolean
lamina_target_set_equal (const LaminaTargetSet *a,
                         const LaminaTargetSet *b)
{
  if (g_strcmp0 (a->id, b->id) != 0
      || g_strcmp0 (a->name, b->name) != 0
      || g_strcmp0 (a->source, b->source) != 0
      || g_strcmp0 (a->notes, b->notes) != 0
      || a->targets->len != b->targets->len)
    return FALSE;
  for (guint i = 0; i < a->targets->len; i++)
    if (!target_equal (g_ptr_array_index (a->targets, i), g_ptr_array_index (b->targets, i)))
      return FALSE;
  return TRUE;
}

gboolean
lamina_same_number (double a,
                    double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

gboolean
lamina_refuse_invalid (GError    **error,
                       int        *line,
                       int         at,
                       const char *format,
                       ...)
{
  g_autofree char *message = NULL;
  va_list args;

  va_start (args, format);
  message = g_strdup_vprintf (format, args);
  va_end (args);
  g_set_error_literal (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID, message);
  if (line != NULL)
    *line = at;
  return FALSE;
}

gboolean
lamina_target_set_validate (const LaminaTargetSet *set,
                            int                   *line,
                            GError               **error)
{
  g_return_val_if_fail (set != NULL, FALSE);

  if (line != NULL)
    *line = 0;
  if (!lamina_identifier_is_valid (set->id))
    return lamina_refuse_invalid (error, line, set->line, _("target set: the id must be 1 to 200 characters without blanks"));
  if (set->name == NULL || set->name[0] == '\0')
    return lamina_refuse_invalid (error, line, set->line, _("target set “%s”: the name is missing"), set->id);
  for (guint i = 0; i < set->targets->len; i++)
    {
      const LaminaTarget *t = g_ptr_array_index (set->targets, i);

      if (!lamina_identifier_is_valid (t->use))
        return lamina_refuse_invalid (error, line, t->line,
                       _("target set “%s”, target %u: the use must be an identifier without blanks"),
                       set->id, i + 1);
      if (lamina_target_set_find (set, t->use) != t)
        return lamina_refuse_invalid (error, line, t->line,
                       _("target set “%s”: the use “%s” is given twice"), set->id, t->use);
      if (!(t->max_u > 0 && t->max_u <= 10))
        return lamina_refuse_invalid (error, line, t->line,
                       _("target set “%s”, use “%s”: max-u=%g is outside the allowed range above 0 to 10 W/(m²·K)"),
                       set->id, t->use, t->max_u);
      if (!isnan (t->min_frsi) && !(t->min_frsi >= 0 && t->min_frsi <= 1))
        return lamina_refuse_invalid (error, line, t->line,
                       _("target set “%s”, use “%s”: min-frsi=%g is outside the allowed range 0 to 1"),
                       set->id, t->use, t->min_frsi);
      if (t->element >= LAMINA_N_ELEMENTS)
        return lamina_refuse_invalid (error, line, t->line,
                       _("target set “%s”, use “%s”: unknown element"), set->id, t->use);
    }
  return TRUE;
}
