/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-job-check.h"

#include <glib/gi18n-lib.h>
#include <math.h>

static const char *const verdict_names[] = {
  "met", "not-met", "no-target", "not-calculated",
};
G_STATIC_ASSERT (G_N_ELEMENTS (verdict_names) == LAMINA_N_VERDICTS);

const char *
lamina_verdict_to_string (LaminaVerdict verdict)
{
  g_return_val_if_fail ((guint) verdict < LAMINA_N_VERDICTS, NULL);
  return verdict_names[verdict];
}

double
lamina_job_result_u (const LaminaResult *result)
{
  if (result == NULL)
    return NAN;
  return result->has_ground ? result->ground.u : result->u_corrected;
}

static void
line_free (LaminaJobLine *line)
{
  g_ptr_array_unref (line->notes);
  g_free (line);
}

void
lamina_job_check_free (LaminaJobCheck *check)
{
  if (check == NULL)
    return;
  g_ptr_array_unref (check->lines);
  g_free (check);
}

/* Flags the calculation itself raises. */
static LaminaEntryFlags
flags_of_result (const LaminaResult *result)
{
  LaminaEntryFlags flags = LAMINA_ENTRY_NONE;

  for (guint i = 0; result != NULL && i < result->warnings->len; i++)
    {
      const LaminaWarning *w = g_ptr_array_index (result->warnings, i);

      /* The construction's own target is not the job's; notes say what
       * the method did as a matter of course. */
      if (w->kind == LAMINA_WARNING_TARGET_NOT_MET || lamina_warning_kind_is_note (w->kind))
        continue;
      if (w->kind == LAMINA_WARNING_RATIO_OUT_OF_RANGE
          || w->kind == LAMINA_WARNING_METAL_BRIDGED_INSULATION)
        flags |= LAMINA_ENTRY_OUT_OF_SCOPE;
      else
        flags |= LAMINA_ENTRY_WARNINGS;
    }
  return flags;
}

static void
add_note (LaminaJobLine *line,
          const char    *format,
          ...) G_GNUC_PRINTF (2, 3);

static void
add_note (LaminaJobLine *line,
          const char    *format,
          ...)
{
  va_list args;

  va_start (args, format);
  g_ptr_array_add (line->notes, g_strdup_vprintf (format, args));
  va_end (args);
}

/* One sentence per flag, in the order a reader should see them. */
static void
write_notes (LaminaJobLine *line)
{
  LaminaEntryFlags f = line->flags;

  if (f & LAMINA_ENTRY_MISSING)
    add_note (line, _("Revision %d of “%s” is not in the library."),
              line->entry->revision, line->entry->construction);
  if (line->verdict == LAMINA_VERDICT_NO_TARGET)
    add_note (line, _("The job has no target for the use “%s”."), line->entry->use);
  if (line->verdict == LAMINA_VERDICT_NOT_MET && line->u > line->max_u)
    add_note (line, _("U %.3f W/(m²·K) is above the maximum %.3f for “%s”."),
              line->u, line->max_u, line->entry->use);
  if (f & LAMINA_ENTRY_FRSI_NOT_MET)
    add_note (line, _("The temperature factor fRsi %.2f is below the minimum %.2f."),
              line->frsi, line->target->min_frsi);
  if (f & LAMINA_ENTRY_NOT_APPROVED)
    add_note (line, _("Revision %d is not approved."), line->entry->revision);
  if (f & LAMINA_ENTRY_NEWER_APPROVED)
    add_note (line, _("Revision %d is approved and newer than the pinned revision %d."),
              line->newer_revision, line->entry->revision);
  if (f & LAMINA_ENTRY_MATERIAL_CHANGED)
    add_note (line, _("Library material data changed since this revision was checked."));
  if ((f & LAMINA_ENTRY_OUT_OF_SCOPE) && line->target != NULL && line->target->ground)
    add_note (line, _("The target is for the floor with the ground (EN ISO 13370); this U is the "
                      "floor construction's alone (EN ISO 6946)."));
  else if (f & LAMINA_ENTRY_OUT_OF_SCOPE)
    add_note (line, _("The construction is outside the scope of EN ISO 6946; see its sheet."));
  if (f & LAMINA_ENTRY_WRONG_ELEMENT)
    add_note (line, _("The use “%s” is for a %s, the construction is a %s."), line->entry->use,
              lamina_element_to_string ((LaminaElement) line->target->element),
              lamina_element_to_string (line->construction->element));
  if (f & LAMINA_ENTRY_MOISTURE_NOT_MET)
    add_note (line, "%s", line->target->moisture == LAMINA_MOISTURE_NO_CONDENSATION
              ? _("Moisture (EN ISO 13788): interstitial condensation occurs; the criterion is none in any month.")
              : _("Moisture (EN ISO 13788): condensate is left at the end of the year; the criterion is that it "
                  "evaporates within the year."));
  if (f & LAMINA_ENTRY_MOISTURE_OPEN)
    add_note (line, _("The moisture criterion “%s” is to be shown by an EN ISO 13788 assessment."),
              lamina_moisture_criterion_to_string (line->target->moisture));
  if (f & LAMINA_ENTRY_CLIMATE_CHANGED)
    add_note (line, _("Library climate data changed since this revision was checked."));
  if (f & LAMINA_ENTRY_WARNINGS)
    add_note (line, _("The calculation gave warnings; see the construction's sheet."));
}

gboolean
lamina_moisture_criterion_met (LaminaMoistureCriterion     criterion,
                               const LaminaMoistureResult *result)
{
  g_return_val_if_fail (result != NULL, FALSE);

  switch (criterion)
    {
    case LAMINA_MOISTURE_NO_CONDENSATION:
      return !result->condensation;
    case LAMINA_MOISTURE_NO_ACCUMULATION:
      return !result->condensation || result->dries_out;
    case LAMINA_MOISTURE_NONE:
    case LAMINA_N_MOISTURE_CRITERIA:
    default:
      return TRUE;
    }
}

/* The target's moisture criterion against the assessment the caller
 * made in the job's climate. */
static LaminaVerdict
check_moisture (LaminaJobLine        *line,
                const LaminaTarget   *t,
                const LaminaJobInput *input)
{
  if (t == NULL || t->moisture == LAMINA_MOISTURE_NONE)
    return LAMINA_VERDICT_NO_TARGET;
  if (input->moisture == NULL)
    {
      line->flags |= LAMINA_ENTRY_MOISTURE_OPEN;
      return LAMINA_VERDICT_NOT_CALCULATED;
    }
  if (lamina_moisture_criterion_met (t->moisture, input->moisture))
    return LAMINA_VERDICT_MET;
  line->flags |= LAMINA_ENTRY_MOISTURE_NOT_MET;
  return LAMINA_VERDICT_NOT_MET;
}

static LaminaJobLine *
check_entry (const LaminaJobEntry  *entry,
             const LaminaTargetSet *targets,
             const LaminaJobInput  *input)
{
  LaminaJobLine *line = g_new0 (LaminaJobLine, 1);
  const LaminaConstruction *c = input->construction;
  const LaminaTarget *t = targets != NULL ? lamina_target_set_find (targets, entry->use) : NULL;

  line->entry = entry;
  line->construction = c;
  line->target = t;
  line->notes = g_ptr_array_new_with_free_func (g_free);
  line->flags = input->flags | flags_of_result (input->result);
  line->newer_revision = input->newer_revision;
  line->u = input->construction != NULL ? lamina_job_result_u (input->result) : NAN;
  line->max_u = t != NULL ? t->max_u : NAN;
  line->frsi = 1.0 - LAMINA_FRSI_SURFACE_RESISTANCE * line->u;
  line->ua = isnan (entry->area) ? NAN : line->u * entry->area;

  if (c != NULL && c->status != LAMINA_STATUS_APPROVED)
    line->flags |= LAMINA_ENTRY_NOT_APPROVED;
  if (c != NULL && t != NULL && t->element >= 0 && (LaminaElement) t->element != c->element)
    line->flags |= LAMINA_ENTRY_WRONG_ELEMENT;
  /* A floor-to-ground target asks for the U with the ground: in scope
   * when the construction states its ground (EN ISO 13370). */
  if (t != NULL && t->ground && (input->result == NULL || !input->result->has_ground))
    line->flags |= LAMINA_ENTRY_OUT_OF_SCOPE;
  line->moisture = input->moisture;
  if (input->moisture != NULL && !isnan (input->moisture->f_rsi))
    line->frsi = input->moisture->f_rsi;
  line->moisture_verdict = check_moisture (line, t, input);

  if (c == NULL || isnan (line->u))
    line->verdict = LAMINA_VERDICT_NOT_CALCULATED;
  else if (t == NULL)
    line->verdict = LAMINA_VERDICT_NO_TARGET;
  else
    {
      gboolean frsi_ok = isnan (t->min_frsi) || line->frsi >= t->min_frsi;

      if (!frsi_ok)
        line->flags |= LAMINA_ENTRY_FRSI_NOT_MET;
      line->verdict = line->u <= t->max_u && frsi_ok && line->moisture_verdict != LAMINA_VERDICT_NOT_MET
                      ? LAMINA_VERDICT_MET : LAMINA_VERDICT_NOT_MET;
    }
  write_notes (line);
  if (input->moisture_problem != NULL && (line->flags & LAMINA_ENTRY_MOISTURE_OPEN))
    add_note (line, "%s", input->moisture_problem);
  return line;
}

static const char *
verdict_word (LaminaVerdict verdict)
{
  return verdict == LAMINA_VERDICT_MET ? _("met")
         : verdict == LAMINA_VERDICT_NOT_MET ? _("NOT MET") : _("not assessed");
}

/* @brief: without the standard's name and the accumulation, for a sheet
 * whose own moisture line gives both. */
static char *
dup_criteria_text (const LaminaJobLine *line,
                   gboolean             brief)
{
  const LaminaTarget *t = line->target;
  g_autoptr(GString) text = NULL;

  if (t == NULL || (isnan (t->min_frsi) && t->moisture == LAMINA_MOISTURE_NONE)
      || line->construction == NULL)
    return NULL;
  text = g_string_new (brief ? "" : "EN ISO 13788:");
  if (!isnan (t->min_frsi) && !isnan (line->frsi))
    g_string_append_printf (text, _(" fRsi %.3f, minimum %.3f: %s"), line->frsi, t->min_frsi,
                            verdict_word ((line->flags & LAMINA_ENTRY_FRSI_NOT_MET)
                                          ? LAMINA_VERDICT_NOT_MET : LAMINA_VERDICT_MET));
  if (t->moisture != LAMINA_MOISTURE_NONE)
    {
      const char *criterion = t->moisture == LAMINA_MOISTURE_NO_CONDENSATION
                              ? _("no interstitial condensation") : _("condensate dries out within the year");

      g_string_append_printf (text, "%s %s: %s", isnan (t->min_frsi) ? "" : ";", criterion,
                              verdict_word (line->moisture_verdict));
      if (line->moisture != NULL && !brief)
        g_string_append_printf (text, _(" (largest accumulation %.3f kg/m², %s)"),
                                line->moisture->max_accumulation,
                                line->moisture->dries_out ? _("dry at the end of the year")
                                                          : _("still wet at the end of the year"));
    }
  return g_strchug (g_string_free (g_steal_pointer (&text), FALSE));
}

char *
lamina_job_line_dup_moisture_text (const LaminaJobLine *line)
{
  return dup_criteria_text (line, FALSE);
}

char *
lamina_job_line_dup_criteria_text (const LaminaJobLine *line)
{
  return dup_criteria_text (line, TRUE);
}

static void
add_to_totals (LaminaJobCheck      *check,
               const LaminaJobLine *line)
{
  LaminaKindTotal *kind;

  if (isnan (line->ua) || line->construction == NULL)
    return;
  kind = &check->kinds[line->construction->element];
  kind->area += line->entry->area;
  kind->ua += line->ua;
  check->area += line->entry->area;
  check->h_t += line->ua;
}

LaminaJobCheck *
lamina_job_check (const LaminaJob       *job,
                  const LaminaTargetSet *targets,
                  const LaminaJobInput  *inputs,
                  guint                  n_inputs)
{
  LaminaJobCheck *check;

  g_return_val_if_fail (job != NULL, NULL);
  g_return_val_if_fail (n_inputs == job->entries->len, NULL);

  check = g_new0 (LaminaJobCheck, 1);
  check->lines = g_ptr_array_new_with_free_func ((GDestroyNotify) line_free);
  for (guint i = 0; i < job->entries->len; i++)
    {
      LaminaJobLine *line = check_entry (g_ptr_array_index (job->entries, i), targets, &inputs[i]);

      g_ptr_array_add (check->lines, line);
      add_to_totals (check, line);
      check->n_met += line->verdict == LAMINA_VERDICT_MET;
      check->n_not_met += line->verdict == LAMINA_VERDICT_NOT_MET;
      check->n_open += line->verdict >= LAMINA_VERDICT_NO_TARGET;
      check->n_flagged += line->flags != LAMINA_ENTRY_NONE;
    }
  for (guint k = 0; k < LAMINA_N_ELEMENTS; k++)
    check->kinds[k].mean_u = check->kinds[k].area > 0
                             ? check->kinds[k].ua / check->kinds[k].area : NAN;
  for (guint i = 0; i < job->junctions->len; i++)
    {
      const LaminaJobJunction *j = g_ptr_array_index (job->junctions, i);

      check->h_junctions += j->psi * j->length;
    }
  check->h_total = check->h_t + check->h_junctions;
  return check;
}
