/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-field-panel.h"

#include <glib/gi18n.h>

#include "lamina-field-draw.h"

/* How often the progress bar reads the worker's progress, ms. */
#define PROGRESS_INTERVAL 100

struct _LaminaFieldPanel
{
  GtkWidget           parent_instance;

  GtkWidget          *box;
  GtkWidget          *run_button;
  GtkWidget          *progress_row;
  GtkProgressBar     *progress;
  GtkWidget          *cancel_button;
  GtkLabel           *status;
  GtkWidget          *picture;

  LaminaConstruction *construction;   /* owned copy */
  LaminaFieldResult  *result;         /* owned */
  GCancellable       *cancellable;    /* of the running check */
  gint                permille;       /* the worker's progress, atomic */
  guint               progress_id;
};

G_DEFINE_FINAL_TYPE (LaminaFieldPanel, lamina_field_panel, GTK_TYPE_WIDGET)

typedef struct
{
  LaminaConstruction *construction;
  GCancellable       *cancellable;
  gint               *permille;       /* in the panel, which outlives the task */
} Job;

static void
job_free (Job *job)
{
  lamina_construction_free (job->construction);
  g_object_unref (job->cancellable);
  g_free (job);
}

/* Worker thread: report, and stop when cancelled. */
static gboolean
worker_progress (double   fraction,
                 gpointer user_data)
{
  Job *job = user_data;

  g_atomic_int_set (job->permille, (gint) (fraction * 1000));
  return !g_cancellable_is_cancelled (job->cancellable);
}

static void
worker (GTask        *task,
        gpointer      source,
        gpointer      task_data,
        GCancellable *cancellable)
{
  Job *job = task_data;
  GError *error = NULL;
  LaminaFieldResult *result = lamina_field_calculate (job->construction, 0, worker_progress, job, &error);

  if (result == NULL)
    g_task_return_error (task, error);
  else
    g_task_return_pointer (task, result, (GDestroyNotify) lamina_field_result_free);
}

static void
set_running (LaminaFieldPanel *self,
             gboolean          running)
{
  gtk_widget_set_visible (self->progress_row, running);
  gtk_widget_set_sensitive (self->run_button, !running);
  if (!running && self->progress_id != 0)
    {
      g_source_remove (self->progress_id);
      self->progress_id = 0;
    }
}

static gboolean
on_progress_tick (gpointer user_data)
{
  LaminaFieldPanel *self = user_data;

  gtk_progress_bar_set_fraction (self->progress, g_atomic_int_get (&self->permille) / 1000.0);
  return G_SOURCE_CONTINUE;
}

static void
show_result (LaminaFieldPanel *self)
{
  const LaminaFieldResult *f = self->result;
  char u[LAMINA_U_TEXT_SIZE], u6946[LAMINA_U_TEXT_SIZE];
  g_autofree char *text = NULL;

  if (f == NULL)
    {
      gtk_widget_set_visible (self->picture, FALSE);
      return;
    }
  text = g_strdup_printf (_("U (2-D) %s · U (EN ISO 6946) %s W/(m²·K)\n"
                            "Coldest inner surface %.1f °C, fRsi %.2f (with Rsi 0.25: %.2f)\n"
                            "Module %.0f mm, %u cells%s"),
                          lamina_format_u (u, f->u), lamina_format_u (u6946, f->u_6946),
                          f->min_inner_surface_temperature, f->f_rsi, f->f_rsi_mould, f->module_width, f->cells,
                          f->refinement.converged ? "" : _(", grid NOT converged to 0.1 %"));
  gtk_label_set_text (self->status, text);
  gtk_widget_set_visible (self->picture, TRUE);
  gtk_widget_queue_draw (self->picture);
}

static void
on_done (GObject      *source,
         GAsyncResult *res,
         gpointer      user_data)
{
  LaminaFieldPanel *self = LAMINA_FIELD_PANEL (source);
  GTask *task = G_TASK (res);
  GError *error = NULL;
  LaminaFieldResult *result = g_task_propagate_pointer (task, &error);

  /* A check of a construction no longer on screen is dropped. */
  if (g_task_get_task_data (task) != NULL
      && ((Job *) g_task_get_task_data (task))->cancellable != self->cancellable)
    {
      g_clear_error (&error);
      g_clear_pointer (&result, lamina_field_result_free);
      return;
    }
  g_clear_object (&self->cancellable);
  set_running (self, FALSE);
  if (result == NULL)
    {
      gtk_label_set_text (self->status, error->message);
      g_error_free (error);
      return;
    }
  g_clear_pointer (&self->result, lamina_field_result_free);
  self->result = result;
  show_result (self);
}

void
lamina_field_panel_run (LaminaFieldPanel *self)
{
  g_autoptr(GTask) task = NULL;
  Job *job;

  g_return_if_fail (LAMINA_IS_FIELD_PANEL (self));
  if (self->construction == NULL || self->cancellable != NULL)
    return;
  self->cancellable = g_cancellable_new ();
  job = g_new0 (Job, 1);
  job->construction = lamina_construction_copy (self->construction);
  job->cancellable = g_object_ref (self->cancellable);
  job->permille = &self->permille;
  g_atomic_int_set (&self->permille, 0);
  task = g_task_new (self, NULL, on_done, NULL);
  g_task_set_task_data (task, job, (GDestroyNotify) job_free);
  g_task_set_return_on_cancel (task, FALSE);
  gtk_label_set_text (self->status, _("Calculating one module…"));
  set_running (self, TRUE);
  self->progress_id = g_timeout_add (PROGRESS_INTERVAL, on_progress_tick, self);
  g_task_run_in_thread (task, worker);
}

void
lamina_field_panel_cancel (LaminaFieldPanel *self)
{
  g_return_if_fail (LAMINA_IS_FIELD_PANEL (self));
  if (self->cancellable != NULL)
    g_cancellable_cancel (self->cancellable);
}

gboolean
lamina_field_panel_is_running (LaminaFieldPanel *self)
{
  return self->cancellable != NULL;
}

const LaminaFieldResult *
lamina_field_panel_get_result (LaminaFieldPanel *self)
{
  return self->result;
}

const char *
lamina_field_panel_get_status_text (LaminaFieldPanel *self)
{
  return gtk_label_get_text (self->status);
}

static void
draw_picture (GtkDrawingArea *area,
              cairo_t        *cr,
              int             width,
              int             height,
              gpointer        user_data)
{
  LaminaFieldPanel *self = user_data;

  if (self->result != NULL && self->construction != NULL)
    lamina_field_draw (cr, self->construction, self->result, 0, 0, width, height, 9.0);
}

void
lamina_field_panel_set_construction (LaminaFieldPanel         *self,
                                     const LaminaConstruction *construction,
                                     const LaminaResult       *result)
{
  gboolean advised = construction != NULL && result != NULL && lamina_field_is_advised (result);

  g_return_if_fail (LAMINA_IS_FIELD_PANEL (self));

  if (construction != NULL && self->construction != NULL
      && lamina_construction_equal_content (construction, self->construction)
      && g_strcmp0 (construction->id, self->construction->id) == 0)
    return;
  /* Changed: what was running or shown no longer applies. */
  if (self->cancellable != NULL)
    {
      g_cancellable_cancel (self->cancellable);
      g_clear_object (&self->cancellable);
      set_running (self, FALSE);
    }
  g_clear_pointer (&self->result, lamina_field_result_free);
  g_clear_pointer (&self->construction, lamina_construction_free);
  if (construction != NULL)
    self->construction = lamina_construction_copy (construction);
  gtk_label_set_text (self->status, _("EN ISO 6946 does not hold for this build-up. Calculate one repeating "
                                      "module numerically (EN ISO 10211); this takes a few seconds."));
  show_result (self);
  gtk_widget_set_visible (GTK_WIDGET (self), advised);
}

static void
lamina_field_panel_dispose (GObject *object)
{
  LaminaFieldPanel *self = LAMINA_FIELD_PANEL (object);

  if (self->cancellable != NULL)
    g_cancellable_cancel (self->cancellable);
  g_clear_object (&self->cancellable);
  if (self->progress_id != 0)
    g_source_remove (self->progress_id);
  self->progress_id = 0;
  g_clear_pointer (&self->box, gtk_widget_unparent);
  g_clear_pointer (&self->result, lamina_field_result_free);
  g_clear_pointer (&self->construction, lamina_construction_free);
  G_OBJECT_CLASS (lamina_field_panel_parent_class)->dispose (object);
}

static void
lamina_field_panel_class_init (LaminaFieldPanelClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_field_panel_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "lamina-field-panel");
}

static void
lamina_field_panel_init (LaminaFieldPanel *self)
{
  GtkWidget *heading = gtk_label_new (_("2-D Check, EN ISO 10211"));
  GtkWidget *area = gtk_drawing_area_new ();

  self->box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  gtk_widget_set_parent (self->box, GTK_WIDGET (self));
  gtk_label_set_xalign (GTK_LABEL (heading), 0);
  gtk_widget_add_css_class (heading, "heading");
  gtk_box_append (GTK_BOX (self->box), heading);

  self->status = GTK_LABEL (gtk_label_new (NULL));
  gtk_label_set_wrap (self->status, TRUE);
  gtk_label_set_xalign (self->status, 0);
  gtk_label_set_max_width_chars (self->status, 40);
  gtk_label_set_selectable (self->status, TRUE);
  gtk_box_append (GTK_BOX (self->box), GTK_WIDGET (self->status));

  self->run_button = gtk_button_new_with_mnemonic (_("_Run 2-D Check"));
  gtk_widget_set_halign (self->run_button, GTK_ALIGN_START);
  g_signal_connect_object (self->run_button, "clicked", G_CALLBACK (lamina_field_panel_run), self,
                           G_CONNECT_SWAPPED);
  gtk_box_append (GTK_BOX (self->box), self->run_button);

  self->progress_row = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  self->progress = GTK_PROGRESS_BAR (gtk_progress_bar_new ());
  gtk_widget_set_hexpand (GTK_WIDGET (self->progress), TRUE);
  gtk_widget_set_valign (GTK_WIDGET (self->progress), GTK_ALIGN_CENTER);
  self->cancel_button = gtk_button_new_with_mnemonic (_("_Cancel"));
  g_signal_connect_object (self->cancel_button, "clicked", G_CALLBACK (lamina_field_panel_cancel), self,
                           G_CONNECT_SWAPPED);
  gtk_box_append (GTK_BOX (self->progress_row), GTK_WIDGET (self->progress));
  gtk_box_append (GTK_BOX (self->progress_row), self->cancel_button);
  gtk_widget_set_visible (self->progress_row, FALSE);
  gtk_box_append (GTK_BOX (self->box), self->progress_row);

  self->picture = area;
  gtk_drawing_area_set_content_height (GTK_DRAWING_AREA (area), 240);
  gtk_drawing_area_set_draw_func (GTK_DRAWING_AREA (area), draw_picture, self, NULL);
  gtk_widget_set_visible (area, FALSE);
  gtk_box_append (GTK_BOX (self->box), area);
  gtk_accessible_update_property (GTK_ACCESSIBLE (area), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Temperature field of one module"), -1);
  gtk_widget_set_visible (GTK_WIDGET (self), FALSE);
}

GtkWidget *
lamina_field_panel_new (void)
{
  return g_object_new (LAMINA_TYPE_FIELD_PANEL, NULL);
}
