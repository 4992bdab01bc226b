/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaJobDialog: a job's own data, new or changed.  The schedule is left
 * as it is; the library checks the whole job (climate and target set
 * known, every entry's use in the set) and its refusal is shown as is. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-job-dialog-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-job-fields.h"

G_DEFINE_FINAL_TYPE (LaminaJobDialog, lamina_job_dialog, GTK_TYPE_WINDOW)

enum { SAVED, N_SIGNALS };
static guint signals[N_SIGNALS];

static void
replace (char **field,
         char  *value)
{
  g_free (*field);
  *field = value;
}

/* The design data; FALSE with the field named. */
static gboolean
read_numbers (LaminaJobDialog  *self,
              LaminaJob        *job,
              GError          **error)
{
  return lamina_job_fields_parse (self->inside_entry, _("Inside design temperature"),
                                  LAMINA_FIELD_INSIDE_TEMPERATURE, FALSE, &job->inside_temperature, error)
         && lamina_job_fields_parse (self->outside_entry, _("Outside design temperature"),
                                     LAMINA_FIELD_OUTSIDE_TEMPERATURE, FALSE, &job->outside_temperature, error)
         && lamina_job_fields_parse (self->ground_area_entry, _("Ground floor area A"),
                                     LAMINA_FIELD_AREA, TRUE, &job->ground_area, error)
         && lamina_job_fields_parse (self->ground_perimeter_entry, _("Exposed perimeter P"),
                                     LAMINA_FIELD_LENGTH, TRUE, &job->ground_perimeter, error)
         && lamina_job_fields_parse (self->ground_b_prime_entry, _("Characteristic dimension B′"),
                                     LAMINA_FIELD_LENGTH, TRUE, &job->ground_b_prime, error);
}

/* EN ISO 13370 needs both A and P, and B′ = A / (0.5 P) is the one figure
 * that counts: either the plan or B′, not half a plan. */
static gboolean
check_ground (LaminaJobDialog  *self,
              const LaminaJob  *job,
              GError          **error)
{
  if (isnan (job->ground_area) != isnan (job->ground_perimeter))
    return lamina_job_fields_refuse (isnan (job->ground_area) ? self->ground_area_entry
                                                              : self->ground_perimeter_entry,
                                     isnan (job->ground_area) ? _("Ground floor area A")
                                                              : _("Exposed perimeter P"),
                                     _("give both A and P (EN ISO 13370), or B′ alone"), error);
  if (job->ground_area == 0)
    return lamina_job_fields_refuse (self->ground_area_entry, _("Ground floor area A"),
                                     _("must be above 0 m²"), error);
  if (!isnan (job->ground_area) && !isnan (job->ground_b_prime))
    return lamina_job_fields_refuse (self->ground_b_prime_entry, _("Characteristic dimension B′"),
                                     _("give either A and P or B′, not both"), error);
  return TRUE;
}

static char *
dup_choice (GtkDropDown *dropdown,
            GStrv        ids)
{
  guint selected = gtk_drop_down_get_selected (dropdown);

  return selected < g_strv_length (ids) && *ids[selected] ? g_strdup (ids[selected]) : NULL;
}

gboolean
lamina_job_dialog_save (LaminaJobDialog  *self,
                        GError          **error)
{
  g_autoptr(LaminaJob) job = lamina_job_copy (self->job);
  g_autofree char *id = lamina_job_fields_dup_text (self->id_entry);
  g_autofree char *name = lamina_job_fields_dup_text (self->name_entry);
  GtkEntry *text_entries[] = { self->id_entry, self->name_entry };

  g_return_val_if_fail (LAMINA_IS_JOB_DIALOG (self), FALSE);

  for (guint i = 0; i < G_N_ELEMENTS (text_entries); i++)
    lamina_job_fields_clear_mark (text_entries[i]);
  if (self->is_new && (id == NULL || !lamina_identifier_is_valid (id)))
    return lamina_job_fields_refuse (self->id_entry, _("Job id"),
                                     _("1 to 200 characters without blanks, e.g. the job number"), error);
  if (name == NULL)
    return lamina_job_fields_refuse (self->name_entry, _("Name"), _("a job needs a name"), error);
  if (self->is_new)
    replace (&job->id, g_steal_pointer (&id));
  replace (&job->name, g_steal_pointer (&name));
  replace (&job->number, lamina_job_fields_dup_text (self->number_entry));
  replace (&job->client, lamina_job_fields_dup_text (self->client_entry));
  replace (&job->site, lamina_job_fields_dup_text (self->site_entry));
  replace (&job->architect, lamina_job_fields_dup_text (self->architect_entry));
  job->status = (LaminaJobStatus) MIN (gtk_drop_down_get_selected (self->status_dropdown),
                                       LAMINA_N_JOB_STATUSES - 1);
  replace (&job->climate, dup_choice (self->climate_dropdown, self->climate_ids));
  replace (&job->target_set, dup_choice (self->targets_dropdown, self->set_ids));
  if (!read_numbers (self, job, error) || !check_ground (self, job, error))
    return FALSE;
  if (!(self->is_new ? lamina_library_create_job (self->library, job, error)
                     : lamina_library_save_job (self->library, job, error)))
    return FALSE;
  g_signal_emit (self, signals[SAVED], 0, job->id);
  gtk_window_destroy (GTK_WINDOW (self));
  return TRUE;
}

static void
on_save_clicked_cb (LaminaJobDialog *self)
{
  g_autoptr(GError) error = NULL;

  if (!lamina_job_dialog_save (self, &error))
    gtk_label_set_text (self->error_label, error->message);
}

/* Fills @dropdown with "none" and each id of @records (named by @name_of),
 * selects @current and returns the ids in list order. */
static GStrv
fill_choices (GtkDropDown *dropdown,
              GPtrArray   *records,
              const char *(*id_of) (gconstpointer record),
              const char *(*name_of) (gconstpointer record),
              const char  *current)
{
  g_autoptr(GStrvBuilder) ids = g_strv_builder_new ();
  g_autoptr(GtkStringList) labels = gtk_string_list_new (NULL);
  guint selected = 0;

  g_strv_builder_add (ids, "");
  gtk_string_list_append (labels, _("None"));
  for (guint i = 0; records != NULL && i < records->len; i++)
    {
      const char *id = id_of (records->pdata[i]);
      g_autofree char *label = g_strdup_printf ("%s (%s)", name_of (records->pdata[i]), id);

      g_strv_builder_add (ids, id);
      gtk_string_list_append (labels, label);
      if (g_strcmp0 (id, current) == 0)
        selected = i + 1;
    }
  if (current != NULL && selected == 0)
    {
      /* Not in the library (any more): kept visible, so that saving
       * names it rather than dropping it. */
      g_autofree char *label = g_strdup_printf (_("%s (not in the library)"), current);

      g_strv_builder_add (ids, current);
      gtk_string_list_append (labels, label);
      selected = records != NULL ? records->len + 1 : 1;
    }
  gtk_drop_down_set_model (dropdown, G_LIST_MODEL (labels));
  gtk_drop_down_set_selected (dropdown, selected);
  return g_strv_builder_end (ids);
}

static const char *
climate_id (gconstpointer record)
{
  return ((const LaminaClimate *) record)->id;
}

static const char *
climate_name (gconstpointer record)
{
  return ((const LaminaClimate *) record)->name;
}

static const char *
set_id (gconstpointer record)
{
  return ((const LaminaTargetSet *) record)->id;
}

static const char *
set_name (gconstpointer record)
{
  return ((const LaminaTargetSet *) record)->name;
}

static void
set_text (GtkEntry   *entry,
          const char *text)
{
  gtk_editable_set_text (GTK_EDITABLE (entry), text != NULL ? text : "");
}

static void
fill (LaminaJobDialog *self)
{
  const LaminaJob *job = self->job;
  g_autoptr(GPtrArray) climates = lamina_library_list_climates (self->library, NULL);
  g_autoptr(GPtrArray) sets = lamina_library_list_target_sets (self->library, NULL);
  g_autoptr(GtkStringList) statuses = gtk_string_list_new (NULL);

  for (guint i = 0; i < LAMINA_N_JOB_STATUSES; i++)
    gtk_string_list_append (statuses, lamina_job_status_to_string ((LaminaJobStatus) i));
  gtk_drop_down_set_model (self->status_dropdown, G_LIST_MODEL (statuses));
  gtk_drop_down_set_selected (self->status_dropdown, job->status);
  set_text (self->id_entry, job->id);
  gtk_editable_set_editable (GTK_EDITABLE (self->id_entry), self->is_new);
  gtk_widget_set_sensitive (GTK_WIDGET (self->id_entry), self->is_new);
  set_text (self->name_entry, job->name);
  set_text (self->number_entry, job->number);
  set_text (self->client_entry, job->client);
  set_text (self->site_entry, job->site);
  set_text (self->architect_entry, job->architect);
  lamina_job_fields_set_number (self->inside_entry, job->inside_temperature, 1);
  lamina_job_fields_set_number (self->outside_entry, job->outside_temperature, 1);
  lamina_job_fields_set_number (self->ground_area_entry, job->ground_area, 2);
  lamina_job_fields_set_number (self->ground_perimeter_entry, job->ground_perimeter, 2);
  lamina_job_fields_set_number (self->ground_b_prime_entry, job->ground_b_prime, 3);
  self->climate_ids = fill_choices (self->climate_dropdown, climates, climate_id, climate_name, job->climate);
  self->set_ids = fill_choices (self->targets_dropdown, sets, set_id, set_name, job->target_set);
  gtk_window_set_title (GTK_WINDOW (self), self->is_new ? _("New Job") : _("Job Data"));
}

static void
lamina_job_dialog_dispose (GObject *object)
{
  LaminaJobDialog *self = LAMINA_JOB_DIALOG (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_JOB_DIALOG);
  g_clear_object (&self->library);
  G_OBJECT_CLASS (lamina_job_dialog_parent_class)->dispose (object);
}

static void
lamina_job_dialog_finalize (GObject *object)
{
  LaminaJobDialog *self = LAMINA_JOB_DIALOG (object);

  g_clear_pointer (&self->job, lamina_job_free);
  g_clear_pointer (&self->climate_ids, g_strfreev);
  g_clear_pointer (&self->set_ids, g_strfreev);
  G_OBJECT_CLASS (lamina_job_dialog_parent_class)->finalize (object);
}

static void
lamina_job_dialog_class_init (LaminaJobDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_job_dialog_dispose;
  object_class->finalize = lamina_job_dialog_finalize;
  signals[SAVED] = g_signal_new ("saved", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                                 NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_STRING);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-job-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, id_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, name_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, number_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, client_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, site_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, architect_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, status_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, inside_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, outside_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, climate_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, ground_area_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, ground_perimeter_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, ground_b_prime_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, targets_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, error_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaJobDialog, save_button);
  gtk_widget_class_bind_template_callback (widget_class, on_save_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
}

static void
lamina_job_dialog_init (LaminaJobDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

LaminaJobDialog *
lamina_job_dialog_new (GtkWindow       *parent,
                       LaminaLibrary   *library,
                       const LaminaJob *job)
{
  LaminaJobDialog *self = g_object_new (LAMINA_TYPE_JOB_DIALOG, "transient-for", parent, NULL);

  self->library = g_object_ref (library);
  self->is_new = job == NULL;
  self->job = job != NULL ? lamina_job_copy (job) : lamina_job_new (NULL, NULL);
  fill (self);
  return self;
}
