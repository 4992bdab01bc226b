/* SPDX-License-Identifier: GPL-3.0-or-later */
/* LaminaTargetSetDialog: the office's tables of requirements per use.
 * The rows are plain widgets in a grid, each row's widgets held in a
 * typed LaminaTargetRow; a removed row is hidden and skipped. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-target-set-dialog-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-job-fields.h"

G_DEFINE_FINAL_TYPE (LaminaTargetSetDialog, lamina_target_set_dialog, GTK_TYPE_WINDOW)

enum { SAVED, N_SIGNALS };
static guint signals[N_SIGNALS];

static const char *const column_titles[] = {
  N_("Use"), N_("Label"), N_("Element"), N_("Max U W/(m²·K)"), N_("Min fRsi"), N_("Moisture"),
  N_("With the ground"),
};

static void
on_remove_row_cb (LaminaTargetRow *row)
{
  GtkWidget *widgets[] = { GTK_WIDGET (row->use), GTK_WIDGET (row->label), GTK_WIDGET (row->element),
                           GTK_WIDGET (row->max_u), GTK_WIDGET (row->min_frsi),
                           GTK_WIDGET (row->moisture), GTK_WIDGET (row->ground), GTK_WIDGET (row->remove) };

  row->removed = TRUE;
  for (guint i = 0; i < G_N_ELEMENTS (widgets); i++)
    gtk_widget_set_visible (widgets[i], FALSE);
}

static GtkDropDown *
create_element_dropdown (void)
{
  g_autoptr(GtkStringList) labels = gtk_string_list_new (NULL);

  gtk_string_list_append (labels, _("any"));
  for (guint k = 0; k < LAMINA_N_ELEMENTS; k++)
    gtk_string_list_append (labels, lamina_element_to_string ((LaminaElement) k));
  return GTK_DROP_DOWN (gtk_drop_down_new (G_LIST_MODEL (g_steal_pointer (&labels)), NULL));
}

static GtkDropDown *
create_moisture_dropdown (void)
{
  g_autoptr(GtkStringList) labels = gtk_string_list_new (NULL);

  for (guint m = 0; m < LAMINA_N_MOISTURE_CRITERIA; m++)
    gtk_string_list_append (labels, lamina_moisture_criterion_to_string ((LaminaMoistureCriterion) m));
  return GTK_DROP_DOWN (gtk_drop_down_new (G_LIST_MODEL (g_steal_pointer (&labels)), NULL));
}

static GtkEntry *
create_entry (int chars)
{
  GtkEntry *entry = GTK_ENTRY (gtk_entry_new ());

  gtk_editable_set_width_chars (GTK_EDITABLE (entry), chars);
  return entry;
}

guint
lamina_target_set_dialog_add_row (LaminaTargetSetDialog *self)
{
  LaminaTargetRow *row = g_new0 (LaminaTargetRow, 1);
  int y = (int) self->rows->len + 1;
  GtkWidget *widgets[8];

  row->use = create_entry (16);
  row->label = create_entry (18);
  row->element = create_element_dropdown ();
  row->max_u = create_entry (6);
  row->min_frsi = create_entry (5);
  row->moisture = create_moisture_dropdown ();
  row->ground = GTK_CHECK_BUTTON (gtk_check_button_new ());
  row->remove = GTK_BUTTON (gtk_button_new_from_icon_name ("list-remove-symbolic"));
  gtk_widget_set_tooltip_text (GTK_WIDGET (row->remove), _("Remove this use"));
  gtk_widget_set_hexpand (GTK_WIDGET (row->label), TRUE);
  g_signal_connect_swapped (row->remove, "clicked", G_CALLBACK (on_remove_row_cb), row);
  widgets[0] = GTK_WIDGET (row->use);
  widgets[1] = GTK_WIDGET (row->label);
  widgets[2] = GTK_WIDGET (row->element);
  widgets[3] = GTK_WIDGET (row->max_u);
  widgets[4] = GTK_WIDGET (row->min_frsi);
  widgets[5] = GTK_WIDGET (row->moisture);
  widgets[6] = GTK_WIDGET (row->ground);
  widgets[7] = GTK_WIDGET (row->remove);
  for (int x = 0; x < (int) G_N_ELEMENTS (widgets); x++)
    gtk_grid_attach (self->rows_grid, widgets[x], x, y, 1, 1);
  g_ptr_array_add (self->rows, row);
  return self->rows->len - 1;
}

static void
fill_row (LaminaTargetRow    *row,
          const LaminaTarget *t)
{
  gtk_editable_set_text (GTK_EDITABLE (row->use), t->use);
  gtk_editable_set_text (GTK_EDITABLE (row->label), t->label ? t->label : "");
  gtk_drop_down_set_selected (row->element, t->element >= 0 ? (guint) t->element + 1 : 0);
  lamina_job_fields_set_number (row->max_u, t->max_u, 4);
  lamina_job_fields_set_number (row->min_frsi, t->min_frsi, 3);
  gtk_drop_down_set_selected (row->moisture, t->moisture);
  gtk_check_button_set_active (row->ground, t->ground);
}

static void
clear_rows (LaminaTargetSetDialog *self)
{
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->rows_grid))) != NULL)
    gtk_grid_remove (self->rows_grid, child);
  g_ptr_array_set_size (self->rows, 0);
  for (guint x = 0; x < G_N_ELEMENTS (column_titles); x++)
    {
      GtkWidget *title = gtk_label_new (_(column_titles[x]));

      gtk_label_set_xalign (GTK_LABEL (title), 0);
      gtk_widget_add_css_class (title, "dim-label");
      gtk_grid_attach (self->rows_grid, title, (int) x, 0, 1, 1);
    }
}

void
lamina_target_set_dialog_show (LaminaTargetSetDialog *self,
                               const char            *id)
{
  g_autoptr(LaminaTargetSet) set = id != NULL ? lamina_library_dup_target_set (self->library, id, NULL) : NULL;

  clear_rows (self);
  self->is_new = set == NULL;
  g_clear_pointer (&self->notes, g_free);
  gtk_label_set_text (self->error_label, "");
  gtk_editable_set_text (GTK_EDITABLE (self->id_entry), set ? set->id : "");
  gtk_widget_set_sensitive (GTK_WIDGET (self->id_entry), set == NULL);
  gtk_editable_set_text (GTK_EDITABLE (self->name_entry), set ? set->name : "");
  gtk_editable_set_text (GTK_EDITABLE (self->source_entry), set && set->source ? set->source : "");
  if (set == NULL)
    {
      lamina_target_set_dialog_add_row (self);
      return;
    }
  self->notes = g_strdup (set->notes);
  for (guint i = 0; i < set->targets->len; i++)
    {
      guint added = lamina_target_set_dialog_add_row (self);

      fill_row (self->rows->pdata[added], set->targets->pdata[i]);
    }
}

/* One row as a target; FALSE with the row and field named. */
static LaminaTarget *
read_row (LaminaTargetRow  *row,
          guint             number,
          GError          **error)
{
  g_autofree char *use = lamina_job_fields_dup_text (row->use);
  g_autofree char *where = g_strdup_printf (_("Row %u (%s)"), number, use ? use : _("no use"));
  g_autofree char *u_label = g_strdup_printf (_("%s, maximum U"), where);
  g_autofree char *frsi_label = g_strdup_printf (_("%s, minimum fRsi"), where);
  g_autoptr(LaminaTarget) t = NULL;
  double max_u = NAN, min_frsi = NAN;

  lamina_job_fields_clear_mark (row->use);
  if (use == NULL || !lamina_identifier_is_valid (use))
    {
      g_autofree char *label = g_strdup_printf (_("%s, use"), where);

      lamina_job_fields_refuse (row->use, label, _("an identifier without blanks, e.g. external-wall"), error);
      return NULL;
    }
  if (!lamina_job_fields_parse (row->max_u, u_label, LAMINA_FIELD_TARGET_U, FALSE, &max_u, error)
      || !lamina_job_fields_parse (row->min_frsi, frsi_label, LAMINA_FIELD_TEMPERATURE_FACTOR, TRUE,
                                   &min_frsi, error))
    return NULL;
  t = lamina_target_new (use, max_u);
  t->label = lamina_job_fields_dup_text (row->label);
  t->element = (int) gtk_drop_down_get_selected (row->element) - 1;
  t->min_frsi = min_frsi;
  t->moisture = (LaminaMoistureCriterion) gtk_drop_down_get_selected (row->moisture);
  t->ground = gtk_check_button_get_active (row->ground);
  return g_steal_pointer (&t);
}

static void fill_sets (LaminaTargetSetDialog *self, const char *selected);

gboolean
lamina_target_set_dialog_save (LaminaTargetSetDialog  *self,
                               GError                **error)
{
  g_autofree char *id = lamina_job_fields_dup_text (self->id_entry);
  g_autofree char *name = lamina_job_fields_dup_text (self->name_entry);
  g_autoptr(LaminaTargetSet) set = NULL;
  g_autoptr(LaminaTargetSet) known = NULL;
  guint number = 0;

  lamina_job_fields_clear_mark (self->id_entry);
  lamina_job_fields_clear_mark (self->name_entry);
  if (id == NULL || !lamina_identifier_is_valid (id))
    return lamina_job_fields_refuse (self->id_entry, _("Id"), _("1 to 200 characters without blanks"), error);
  if (name == NULL)
    return lamina_job_fields_refuse (self->name_entry, _("Name"), _("a target set needs a name"), error);
  set = lamina_target_set_new (id, name);
  set->source = lamina_job_fields_dup_text (self->source_entry);
  set->notes = g_strdup (self->notes);
  for (guint i = 0; i < self->rows->len; i++)
    {
      LaminaTargetRow *row = self->rows->pdata[i];
      LaminaTarget *t;

      if (row->removed)
        continue;
      t = read_row (row, ++number, error);
      if (t == NULL)
        return FALSE;
      if (lamina_target_set_find (set, t->use) != NULL)
        {
          g_autofree char *label = g_strdup_printf (_("Row %u (%s), use"), number, t->use);

          lamina_target_free (t);
          return lamina_job_fields_refuse (row->use, label, _("each use once in a set"), error);
        }
      lamina_target_set_add (set, t);
    }
  known = self->is_new ? lamina_library_dup_target_set (self->library, id, NULL) : NULL;
  if (known != NULL)
    return lamina_job_fields_refuse (self->id_entry, _("Id"), _("the library has a target set with this id"),
                                     error);
  if (!lamina_library_put_target_set (self->library, set, error))
    return FALSE;
  gtk_label_set_text (self->error_label, "");
  fill_sets (self, set->id);
  g_signal_emit (self, signals[SAVED], 0, set->id);
  return TRUE;
}

static void
on_save_clicked_cb (LaminaTargetSetDialog *self)
{
  g_autoptr(GError) error = NULL;

  if (!lamina_target_set_dialog_save (self, &error))
    gtk_label_set_text (self->error_label, error->message);
}

static void
on_add_row_clicked_cb (LaminaTargetSetDialog *self)
{
  lamina_target_set_dialog_add_row (self);
}

static void
on_set_selected_cb (LaminaTargetSetDialog *self)
{
  guint selected = gtk_drop_down_get_selected (self->set_dropdown);

  if (self->filling || self->set_ids == NULL || selected >= g_strv_length (self->set_ids))
    return;
  lamina_target_set_dialog_show (self, *self->set_ids[selected] ? self->set_ids[selected] : NULL);
}

/* The library's sets and "New target set", @selected chosen (NULL: new). */
static void
fill_sets (LaminaTargetSetDialog *self,
           const char            *selected)
{
  g_autoptr(GPtrArray) sets = lamina_library_list_target_sets (self->library, NULL);
  g_autoptr(GStrvBuilder) ids = g_strv_builder_new ();
  g_autoptr(GtkStringList) labels = gtk_string_list_new (NULL);
  guint index = sets != NULL ? sets->len : 0;

  for (guint i = 0; sets != NULL && i < sets->len; i++)
    {
      const LaminaTargetSet *set = sets->pdata[i];
      g_autofree char *label = g_strdup_printf ("%s (%s)", set->name, set->id);

      g_strv_builder_add (ids, set->id);
      gtk_string_list_append (labels, label);
      if (g_strcmp0 (set->id, selected) == 0)
        index = i;
    }
  g_strv_builder_add (ids, "");
  gtk_string_list_append (labels, _("New target set"));
  g_clear_pointer (&self->set_ids, g_strfreev);
  self->set_ids = g_strv_builder_end (ids);
  self->filling = TRUE;
  gtk_drop_down_set_model (self->set_dropdown, G_LIST_MODEL (labels));
  gtk_drop_down_set_selected (self->set_dropdown, index);
  self->filling = FALSE;
  self->is_new = *self->set_ids[index] == '\0';
  gtk_widget_set_sensitive (GTK_WIDGET (self->id_entry), self->is_new);
}

static void
lamina_target_set_dialog_dispose (GObject *object)
{
  LaminaTargetSetDialog *self = LAMINA_TARGET_SET_DIALOG (object);

  self->filling = TRUE;
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_TARGET_SET_DIALOG);
  g_clear_object (&self->library);
  G_OBJECT_CLASS (lamina_target_set_dialog_parent_class)->dispose (object);
}

static void
lamina_target_set_dialog_finalize (GObject *object)
{
  LaminaTargetSetDialog *self = LAMINA_TARGET_SET_DIALOG (object);

  g_clear_pointer (&self->rows, g_ptr_array_unref);
  g_clear_pointer (&self->set_ids, g_strfreev);
  g_clear_pointer (&self->notes, g_free);
  G_OBJECT_CLASS (lamina_target_set_dialog_parent_class)->finalize (object);
}

static void
lamina_target_set_dialog_class_init (LaminaTargetSetDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_target_set_dialog_dispose;
  object_class->finalize = lamina_target_set_dialog_finalize;
  signals[SAVED] = g_signal_new ("saved", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                                 NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_STRING);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-target-set-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetSetDialog, set_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetSetDialog, id_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetSetDialog, name_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetSetDialog, source_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetSetDialog, rows_grid);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetSetDialog, error_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaTargetSetDialog, save_button);
  gtk_widget_class_bind_template_callback (widget_class, on_save_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_add_row_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_set_selected_cb);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
}

static void
lamina_target_set_dialog_init (LaminaTargetSetDialog *self)
{
  self->filling = TRUE;
  gtk_widget_init_template (GTK_WIDGET (self));
  self->rows = g_ptr_array_new_with_free_func (g_free);
  self->filling = FALSE;
}

LaminaTargetSetDialog *
lamina_target_set_dialog_new (GtkWindow     *parent,
                              LaminaLibrary *library,
                              const char    *id)
{
  LaminaTargetSetDialog *self = g_object_new (LAMINA_TYPE_TARGET_SET_DIALOG, "transient-for", parent, NULL);

  self->library = g_object_ref (library);
  fill_sets (self, id);
  lamina_target_set_dialog_show (self, id);
  return self;
}
