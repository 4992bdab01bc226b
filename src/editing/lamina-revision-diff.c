/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-revision-diff.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-text.h"

static gboolean
same (double a,
      double b)
{
  return (isnan (a) && isnan (b)) || fabs (a - b) < 1e-9;
}

static void
diff_number (GPtrArray  *out,
             const char *what,
             double      a,
             double      b,
             int         decimals)
{
  g_autofree char *x = NULL;
  g_autofree char *y = NULL;

  if (same (a, b))
    return;
  x = lamina_text_number (a, decimals);
  y = lamina_text_number (b, decimals);
  /* Translators: "Target U: 0.20 → 0.18" */
  g_ptr_array_add (out, g_strdup_printf (_("%s: %s → %s"), what, x, y));
}

static void
diff_text (GPtrArray  *out,
           const char *what,
           const char *a,
           const char *b)
{
  if (g_strcmp0 (a, b) == 0)
    return;
  g_ptr_array_add (out, g_strdup_printf (_("%s: “%s” → “%s”"), what, a ? a : "", b ? b : ""));
}

static void
diff_layers (GPtrArray                *out,
             const LaminaConstruction *older,
             const LaminaConstruction *newer)
{
  guint n = MAX (older->layers->len, newer->layers->len);

  for (guint i = 0; i < n; i++)
    {
      const LaminaLayer *a = i < older->layers->len ? older->layers->pdata[i] : NULL;
      const LaminaLayer *b = i < newer->layers->len ? newer->layers->pdata[i] : NULL;

      if (a == NULL)
        g_ptr_array_add (out, g_strdup_printf (_("Layer %u added: %s"), i + 1, lamina_layer_get_label (b)));
      else if (b == NULL)
        g_ptr_array_add (out, g_strdup_printf (_("Layer %u removed: %s"), i + 1, lamina_layer_get_label (a)));
      else if (!lamina_layer_equal (a, b))
        {
          if (g_strcmp0 (lamina_layer_get_label (a), lamina_layer_get_label (b)) != 0 || a->kind != b->kind)
            g_ptr_array_add (out, g_strdup_printf (_("Layer %u: %s → %s"), i + 1,
                                                   lamina_layer_get_label (a), lamina_layer_get_label (b)));
          if (!same (a->thickness, b->thickness))
            {
              g_autofree char *x = lamina_text_mm (a->thickness);
              g_autofree char *y = lamina_text_mm (b->thickness);

              g_ptr_array_add (out, g_strdup_printf (_("Layer %u, %s: %s → %s"), i + 1,
                                                     lamina_layer_get_label (b), x, y));
            }
          else if (g_strcmp0 (lamina_layer_get_label (a), lamina_layer_get_label (b)) == 0 && a->kind == b->kind)
            g_ptr_array_add (out, g_strdup_printf (_("Layer %u, %s: data changed"), i + 1,
                                                   lamina_layer_get_label (b)));
        }
    }
}

static char *
join_tags (const LaminaConstruction *c)
{
  GString *out = g_string_new (NULL);

  for (guint i = 0; i < c->tags->len; i++)
    g_string_append_printf (out, i ? ", %s" : "%s", (const char *) c->tags->pdata[i]);
  return g_string_free (out, FALSE);
}

static const char *
outer_side_name (LaminaOuterSide side)
{
  return side == LAMINA_OUTER_SIDE_INDOOR ? _("Indoor (another heated space)") : _("Outdoor");
}

/* Element, heat flow, outer side, tags and notes. */
static void
diff_properties (GPtrArray                *out,
                 const LaminaConstruction *older,
                 const LaminaConstruction *newer)
{
  g_autofree char *tags_a = join_tags (older);
  g_autofree char *tags_b = join_tags (newer);

  if (older->element != newer->element)
    diff_text (out, _("Element"), lamina_text_element_name (older->element),
               lamina_text_element_name (newer->element));
  if (older->heat_flow != newer->heat_flow)
    diff_text (out, _("Heat flow"), lamina_text_heat_flow_name (older->heat_flow),
               lamina_text_heat_flow_name (newer->heat_flow));
  if (older->outer_side != newer->outer_side)
    diff_text (out, _("Outer side"), outer_side_name (older->outer_side), outer_side_name (newer->outer_side));
  diff_text (out, _("Tags"), tags_a, tags_b);
  diff_text (out, _("Notes"), older->notes, newer->notes);
}

GPtrArray *
lamina_revision_diff (const LaminaConstruction *older,
                      const LaminaConstruction *newer)
{
  GPtrArray *out = g_ptr_array_new_with_free_func (g_free);

  g_return_val_if_fail (older != NULL && newer != NULL, out);

  diff_text (out, _("Code"), older->code, newer->code);
  diff_text (out, _("Name"), older->name, newer->name);
  diff_text (out, _("Description"), older->description, newer->description);
  diff_properties (out, older, newer);
  diff_number (out, _("Target U"), older->target_u, newer->target_u, 2);
  diff_number (out, _("Inside temperature"), older->inside_temperature, newer->inside_temperature, 1);
  diff_number (out, _("Outside temperature"), older->outside_temperature, newer->outside_temperature, 1);
  diff_layers (out, older, newer);
  return out;
}

GPtrArray *
lamina_revision_diff_job_entry (LaminaLibrary        *library,
                                const LaminaJobEntry *entry)
{
  g_autoptr(LaminaConstruction) origin = NULL;
  g_autoptr(LaminaConstruction) variant = NULL;
  g_autoptr(GError) error = NULL;
  GPtrArray *differences;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);
  g_return_val_if_fail (entry != NULL, NULL);

  if (!lamina_job_entry_is_variant (entry))
    return NULL;
  origin = lamina_library_dup_construction (library, entry->origin, entry->origin_revision, &error);
  if (origin != NULL)
    variant = lamina_library_dup_construction (library, entry->construction, entry->revision, &error);
  if (variant == NULL)
    {
      differences = g_ptr_array_new_with_free_func (g_free);
      g_ptr_array_add (differences, g_strdup (error->message));
      return differences;
    }
  /* A variant's own name and code (a copy has none) say which it is; what
   * it changes is the rest. */
  g_free (variant->name);
  variant->name = g_strdup (origin->name);
  g_free (variant->code);
  variant->code = g_strdup (origin->code);
  return lamina_revision_diff (origin, variant);
}

char *
lamina_revision_diff_dup_variant_text (LaminaLibrary        *library,
                                       const LaminaJobEntry *entry)
{
  g_autoptr(GPtrArray) differences = lamina_revision_diff_job_entry (library, entry);
  g_autoptr(GString) text = NULL;

  if (differences == NULL)
    return NULL;
  text = g_string_new (NULL);
  g_string_printf (text, _("Job variant of %s revision %d"), entry->origin, entry->origin_revision);
  for (guint k = 0; k < differences->len; k++)
    g_string_append_printf (text, "%s %s", k == 0 ? ":" : ";", (const char *) differences->pdata[k]);
  if (differences->len == 0)
    g_string_append (text, _(": no difference yet"));
  g_string_append_c (text, '.');
  return g_string_free (g_steal_pointer (&text), FALSE);
}

void
lamina_revision_diff_note_variants (LaminaLibrary   *library,
                                    LaminaJobReport *report)
{
  for (guint i = 0; i < report->check->lines->len; i++)
    {
      LaminaJobLine *line = report->check->lines->pdata[i];
      char *text = lamina_revision_diff_dup_variant_text (library, line->entry);

      if (text != NULL)
        g_ptr_array_add (line->notes, text);
    }
}
