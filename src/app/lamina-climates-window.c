/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-climates-window.c: the library's climates (EN ISO 13788).  The
 * form holds one climate: name, id, source and the twelve monthly means of
 * θe and φe; every field is parsed in the locale's notation and a refusal
 * names the month and the field. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-climates-window-private.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "lamina-number.h"
#include "lamina-text.h"
#include "store/lamina-library-safety.h"
#include "lamina-window-work.h"

G_DEFINE_FINAL_TYPE (LaminaClimatesWindow, lamina_climates_window, GTK_TYPE_WINDOW)

static void
set_status (LaminaClimatesWindow *self,
            const char           *text,
            gboolean              is_error)
{
  gtk_label_set_text (self->status, text ? text : "");
  if (is_error)
    gtk_widget_add_css_class (GTK_WIDGET (self->status), "lamina-error");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (self->status), "lamina-error");
}

static void
set_entry_number (GtkEntry *entry,
                  double    value,
                  int       decimals)
{
  g_autofree char *text = isnan (value) ? g_strdup ("") : lamina_text_number (value, decimals);

  gtk_editable_set_text (GTK_EDITABLE (entry), text);
  gtk_widget_remove_css_class (GTK_WIDGET (entry), "error");
}

static void
fill_form (LaminaClimatesWindow *self,
           const LaminaClimate  *climate)
{
  gboolean writable = !lamina_library_is_read_only (self->library);

  g_free (self->shown_id);
  self->shown_id = climate ? g_strdup (climate->id) : NULL;
  gtk_editable_set_text (GTK_EDITABLE (self->id_entry), climate ? climate->id : "");
  gtk_editable_set_text (GTK_EDITABLE (self->name_entry), climate && climate->name ? climate->name : "");
  gtk_editable_set_text (GTK_EDITABLE (self->source_entry), climate && climate->source ? climate->source : "");
  /* An id is how constructions name the climate: fixed once stored. */
  gtk_editable_set_editable (GTK_EDITABLE (self->id_entry), climate == NULL && writable);
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      set_entry_number (self->temperature[m], climate ? climate->temperature[m] : NAN, 1);
      set_entry_number (self->humidity[m], climate ? 100.0 * climate->humidity[m] : NAN, 0);
    }
  gtk_widget_set_sensitive (self->delete_button, climate != NULL && writable);
  gtk_widget_set_sensitive (self->save_button, writable);
  gtk_widget_set_sensitive (self->new_button, writable);
  set_status (self, writable ? NULL : _("This library is read-only: climates can be viewed, not changed."), FALSE);
}

static void
reload_list (LaminaClimatesWindow *self,
             const char           *select_id)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) climates = lamina_library_list_climates (self->library, &error);
  GtkWidget *child;
  const LaminaClimate *selected = NULL;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->list))) != NULL)
    gtk_list_box_remove (self->list, child);
  g_ptr_array_set_size (self->ids, 0);
  if (climates == NULL)
    {
      set_status (self, error->message, TRUE);
      return;
    }
  for (guint i = 0; i < climates->len; i++)
    {
      const LaminaClimate *climate = climates->pdata[i];
      GtkWidget *label = gtk_label_new (climate->name ? climate->name : climate->id);

      gtk_label_set_xalign (GTK_LABEL (label), 0);
      gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
      gtk_widget_set_tooltip_text (label, climate->id);
      gtk_list_box_append (self->list, label);
      g_ptr_array_add (self->ids, g_strdup (climate->id));
      if (selected == NULL && (select_id == NULL || g_strcmp0 (select_id, climate->id) == 0))
        {
          selected = climate;
          gtk_list_box_select_row (self->list, gtk_list_box_get_row_at_index (self->list, (int) i));
        }
    }
  fill_form (self, selected);
}

gboolean
lamina_climates_window_select (LaminaClimatesWindow *self,
                               const char           *id)
{
  g_return_val_if_fail (LAMINA_IS_CLIMATES_WINDOW (self), FALSE);
  g_return_val_if_fail (id != NULL, FALSE);

  for (guint i = 0; i < self->ids->len; i++)
    if (g_str_equal (self->ids->pdata[i], id))
      {
        gtk_list_box_select_row (self->list, gtk_list_box_get_row_at_index (self->list, (int) i));
        return TRUE;
      }
  return FALSE;
}

static void
on_row_selected_cb (LaminaClimatesWindow *self,
                    GtkListBoxRow        *row)
{
  g_autoptr(LaminaClimate) climate = NULL;
  g_autoptr(GError) error = NULL;
  int index = row ? gtk_list_box_row_get_index (row) : -1;

  if (index < 0 || (guint) index >= self->ids->len)
    return;
  if (g_strcmp0 (self->shown_id, self->ids->pdata[index]) == 0)
    return;
  climate = lamina_library_dup_climate (self->library, self->ids->pdata[index], &error);
  if (climate == NULL)
    {
      set_status (self, error->message, TRUE);
      return;
    }
  fill_form (self, climate);
}

void
lamina_climates_window_new_climate (LaminaClimatesWindow *self)
{
  g_return_if_fail (LAMINA_IS_CLIMATES_WINDOW (self));

  gtk_list_box_unselect_all (self->list);
  fill_form (self, NULL);
  set_status (self, _("A new climate: give it a name, an id and the twelve monthly means."), FALSE);
  gtk_widget_grab_focus (GTK_WIDGET (self->name_entry));
}

/* One field of the form, marked and refused with the month named. */
static gboolean
read_month_field (GtkEntry           *entry,
                  LaminaNumberField   field,
                  int                 month,
                  double             *value,
                  GError            **error)
{
  g_autoptr(GError) local = NULL;

  if (lamina_number_parse (field, gtk_editable_get_text (GTK_EDITABLE (entry)), value, &local))
    {
      gtk_widget_remove_css_class (GTK_WIDGET (entry), "error");
      return TRUE;
    }
  gtk_widget_add_css_class (GTK_WIDGET (entry), "error");
  gtk_widget_grab_focus (GTK_WIDGET (entry));
  g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
               /* TRANSLATORS: "March: relative humidity …: the value is …" */
               _("%s: %s"), lamina_month_name (month), local->message);
  return FALSE;
}

static LaminaClimate *
read_form (LaminaClimatesWindow  *self,
           GError               **error)
{
  g_autofree char *id = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->id_entry))));
  g_autofree char *name = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->name_entry))));
  g_autofree char *source = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->source_entry))));
  g_autoptr(LaminaClimate) climate = NULL;

  if (*name == '\0')
    {
      g_set_error_literal (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID, _("Name: a climate needs a name"));
      return NULL;
    }
  if (*id == '\0' || strpbrk (id, " \t\n\"<>&") != NULL)
    {
      g_set_error_literal (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                           _("Id: a climate needs an id without spaces or the characters \" < > &"));
      return NULL;
    }
  if (self->shown_id == NULL)
    {
      g_autoptr(LaminaClimate) existing = lamina_library_dup_climate (self->library, id, NULL);

      if (existing != NULL)
        {
          g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                       _("Id: the library already has a climate “%s” (%s)"), id, existing->name);
          return NULL;
        }
    }
  climate = lamina_climate_new (id, name);
  climate->source = *source ? g_strdup (source) : NULL;
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      double h;

      if (!read_month_field (self->temperature[m], LAMINA_FIELD_OUTSIDE_TEMPERATURE, m + 1,
                             &climate->temperature[m], error)
          || !read_month_field (self->humidity[m], LAMINA_FIELD_RELATIVE_HUMIDITY, m + 1, &h, error))
        return NULL;
      climate->humidity[m] = h / 100.0;
    }
  return g_steal_pointer (&climate);
}

/* A changed climate re-flags every construction checked with other data
 * for it (the whole library's flags are worked out again: about a second
 * at 100,000 constructions), so the write runs in a worker on a connection
 * of its own (lamina-window-work.h) while a bar pulses here. */
static gboolean
save_climate_work (LaminaLibrary  *library,
                   gpointer        data,
                   GCancellable   *cancellable,
                   GError        **error)
{
  return lamina_library_put_climate (library, data, error);
}

static gboolean
pulse_cb (gpointer data)
{
  LaminaClimatesWindow *self = data;

  gtk_progress_bar_pulse (self->progress);
  return G_SOURCE_CONTINUE;
}

static void
set_saving (LaminaClimatesWindow *self,
            gboolean              saving)
{
  self->saving = saving;
  gtk_widget_set_visible (GTK_WIDGET (self->progress), saving);
  /* One write at a time: the form stays as it was sent until it is stored. */
  gtk_widget_set_sensitive (self->save_button, !saving);
  gtk_widget_set_sensitive (self->delete_button, !saving);
  gtk_widget_set_sensitive (self->new_button, !saving);
  gtk_widget_set_sensitive (GTK_WIDGET (self->list), !saving);
  g_clear_handle_id (&self->pulse, g_source_remove);
  if (saving)
    self->pulse = g_timeout_add (100, pulse_cb, self);
}

static void
on_climate_saved_cb (GObject      *source,
                     GAsyncResult *result,
                     gpointer      user_data)
{
  LaminaClimatesWindow *self = LAMINA_CLIMATES_WINDOW (source);
  const LaminaClimate *climate = lamina_library_work_get_data (result);
  g_autoptr(GError) error = NULL;
  g_autofree char *message = NULL;
  gboolean ok = lamina_library_work_finish (result, &error);

  if (self->library == NULL)   /* closed meanwhile */
    return;
  set_saving (self, FALSE);
  if (!ok)
    {
      set_status (self, error->message, TRUE);
      return;
    }
  g_clear_pointer (&self->shown_id, g_free);
  reload_list (self, climate->id);
  message = g_strdup_printf (_("Climate “%s” saved. Constructions checked with other data for it are "
                               "flagged for re-checking."), climate->name);
  set_status (self, message, FALSE);
}

gboolean
lamina_climates_window_save (LaminaClimatesWindow  *self,
                             GError               **error)
{
  g_autoptr(GError) local = NULL;
  g_autoptr(LaminaClimate) climate = NULL;
  g_autofree char *message = NULL;

  g_return_val_if_fail (LAMINA_IS_CLIMATES_WINDOW (self), FALSE);
  g_return_val_if_fail (!self->saving, FALSE);

  climate = read_form (self, &local);
  if (climate == NULL
      || (!lamina_climate_validate (climate, &local)))
    {
      set_status (self, local->message, TRUE);
      g_propagate_error (error, g_steal_pointer (&local));
      return FALSE;
    }
  message = g_strdup_printf (_("Saving climate “%s” and checking the constructions that use it…"),
                             climate->name);
  set_status (self, message, FALSE);
  set_saving (self, TRUE);
  lamina_library_work_run_async (self->library, save_climate_work, g_steal_pointer (&climate),
                                 (GDestroyNotify) lamina_climate_free, self, NULL,
                                 on_climate_saved_cb, NULL);
  return TRUE;
}

gboolean
lamina_climates_window_is_saving (LaminaClimatesWindow *self)
{
  g_return_val_if_fail (LAMINA_IS_CLIMATES_WINDOW (self), FALSE);
  return self->saving;
}

gboolean
lamina_climates_window_delete (LaminaClimatesWindow  *self,
                               GError               **error)
{
  g_autoptr(GError) local = NULL;
  g_autofree char *id = NULL;
  g_autofree char *message = NULL;

  g_return_val_if_fail (LAMINA_IS_CLIMATES_WINDOW (self), FALSE);
  if (self->shown_id == NULL)
    return TRUE;
  id = g_strdup (self->shown_id);
  if (!lamina_library_delete_climate (self->library, id, &local))
    {
      set_status (self, local->message, TRUE);
      g_propagate_error (error, g_steal_pointer (&local));
      return FALSE;
    }
  g_clear_pointer (&self->shown_id, g_free);
  reload_list (self, NULL);
  message = g_strdup_printf (_("Climate “%s” deleted."), id);
  set_status (self, message, FALSE);
  return TRUE;
}

static void
on_save_clicked_cb (LaminaClimatesWindow *self)
{
  if (!self->saving)
    lamina_climates_window_save (self, NULL);
}

static void
on_delete_clicked_cb (LaminaClimatesWindow *self)
{
  lamina_climates_window_delete (self, NULL);
}

static void
build_months (LaminaClimatesWindow *self)
{
  const char *heads[] = { N_("Month"), N_("θe, °C"), N_("φe, %") };

  for (guint c = 0; c < G_N_ELEMENTS (heads); c++)
    {
      GtkWidget *label = gtk_label_new (_(heads[c]));

      gtk_label_set_xalign (GTK_LABEL (label), 0);
      gtk_widget_add_css_class (label, "dim-label");
      gtk_widget_add_css_class (label, "caption");
      gtk_grid_attach (self->months_grid, label, (int) c, 0, 1, 1);
    }
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      GtkWidget *label = gtk_label_new (lamina_month_name (m + 1));
      g_autofree char *t_name = g_strdup_printf (_("%s, mean outside temperature, °C"), lamina_month_name (m + 1));
      g_autofree char *h_name = g_strdup_printf (_("%s, mean outside relative humidity, %%"),
                                                 lamina_month_name (m + 1));

      gtk_label_set_xalign (GTK_LABEL (label), 0);
      self->temperature[m] = GTK_ENTRY (gtk_entry_new ());
      self->humidity[m] = GTK_ENTRY (gtk_entry_new ());
      gtk_editable_set_width_chars (GTK_EDITABLE (self->temperature[m]), 7);
      gtk_editable_set_width_chars (GTK_EDITABLE (self->humidity[m]), 7);
      gtk_entry_set_input_purpose (self->temperature[m], GTK_INPUT_PURPOSE_NUMBER);
      gtk_entry_set_input_purpose (self->humidity[m], GTK_INPUT_PURPOSE_NUMBER);
      gtk_accessible_update_property (GTK_ACCESSIBLE (self->temperature[m]), GTK_ACCESSIBLE_PROPERTY_LABEL, t_name, -1);
      gtk_accessible_update_property (GTK_ACCESSIBLE (self->humidity[m]), GTK_ACCESSIBLE_PROPERTY_LABEL, h_name, -1);
      gtk_grid_attach (self->months_grid, label, 0, m + 1, 1, 1);
      gtk_grid_attach (self->months_grid, GTK_WIDGET (self->temperature[m]), 1, m + 1, 1, 1);
      gtk_grid_attach (self->months_grid, GTK_WIDGET (self->humidity[m]), 2, m + 1, 1, 1);
    }
}

static void
lamina_climates_window_dispose (GObject *object)
{
  LaminaClimatesWindow *self = LAMINA_CLIMATES_WINDOW (object);

  g_clear_handle_id (&self->pulse, g_source_remove);
  g_clear_object (&self->library);
  g_clear_pointer (&self->ids, g_ptr_array_unref);
  g_clear_pointer (&self->shown_id, g_free);
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_CLIMATES_WINDOW);

  G_OBJECT_CLASS (lamina_climates_window_parent_class)->dispose (object);
}

static void
lamina_climates_window_class_init (LaminaClimatesWindowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_climates_window_dispose;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-climates-window.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, list);
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, id_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, name_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, source_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, months_grid);
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, status);
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, progress);
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, save_button);
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, delete_button);
  gtk_widget_class_bind_template_child (widget_class, LaminaClimatesWindow, new_button);
}

static void
lamina_climates_window_init (LaminaClimatesWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  self->ids = g_ptr_array_new_with_free_func (g_free);
  build_months (self);
  g_signal_connect_object (self->list, "row-selected", G_CALLBACK (on_row_selected_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->save_button, "clicked", G_CALLBACK (on_save_clicked_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->delete_button, "clicked", G_CALLBACK (on_delete_clicked_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->new_button, "clicked", G_CALLBACK (lamina_climates_window_new_climate), self,
                           G_CONNECT_SWAPPED);
}

LaminaClimatesWindow *
lamina_climates_window_new (GtkWindow     *parent,
                            LaminaLibrary *library)
{
  LaminaClimatesWindow *self;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);
  self = g_object_new (LAMINA_TYPE_CLIMATES_WINDOW, "transient-for", parent, NULL);
  self->library = g_object_ref (library);
  reload_list (self, NULL);
  return self;
}

GtkWindow *
lamina_climates_window_present (GtkWindow     *parent,
                                LaminaLibrary *library)
{
  GtkWindow *window = GTK_WINDOW (lamina_climates_window_new (parent, library));

  gtk_window_present (window);
  return window;
}
