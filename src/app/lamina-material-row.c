/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-material-row-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-number.h"
#include "lamina-sheet-format.h"
#include "lamina-text.h"

G_DEFINE_FINAL_TYPE (LaminaMaterialRow, lamina_material_row, GTK_TYPE_LIST_BOX_ROW)

enum
{
  SAVE,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

/* The number fields and where each lives in the material and the row.
 * Blank means "not known" (NAN) for all but λ. */
static const struct
{
  LaminaNumberField  field;
  gsize              material_offset;
  gsize              entry_offset;
  int                decimals;
  gboolean           optional;
} numbers[] = {
  { LAMINA_FIELD_CONDUCTIVITY, G_STRUCT_OFFSET (LaminaMaterial, conductivity),
    G_STRUCT_OFFSET (LaminaMaterialRow, lambda), 3, FALSE },
  { LAMINA_FIELD_DENSITY, G_STRUCT_OFFSET (LaminaMaterial, density),
    G_STRUCT_OFFSET (LaminaMaterialRow, density), 0, TRUE },
  { LAMINA_FIELD_SPECIFIC_HEAT, G_STRUCT_OFFSET (LaminaMaterial, specific_heat),
    G_STRUCT_OFFSET (LaminaMaterialRow, heat), 0, TRUE },
  { LAMINA_FIELD_VAPOUR_RESISTANCE, G_STRUCT_OFFSET (LaminaMaterial, vapour_resistance_factor),
    G_STRUCT_OFFSET (LaminaMaterialRow, mu), 0, TRUE },
  { LAMINA_FIELD_EMISSIVITY, G_STRUCT_OFFSET (LaminaMaterial, emissivity),
    G_STRUCT_OFFSET (LaminaMaterialRow, emissivity), 2, TRUE },
};

#define NUMBER_ENTRY(self, i) G_STRUCT_MEMBER (GtkEntry *, (self), numbers[i].entry_offset)
#define NUMBER_VALUE(m, i) G_STRUCT_MEMBER (double, (m), numbers[i].material_offset)

void
lamina_material_row_show_error (LaminaMaterialRow *self,
                                const char        *message)
{
  g_return_if_fail (LAMINA_IS_MATERIAL_ROW (self));
  gtk_label_set_text (self->error, message ? message : "");
  gtk_widget_set_visible (GTK_WIDGET (self->error), message != NULL);
}

static gboolean
read_number (LaminaMaterialRow *self,
             guint              i,
             double            *value)
{
  GtkWidget *entry = GTK_WIDGET (NUMBER_ENTRY (self, i));
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));
  g_autoptr(GError) error = NULL;

  gtk_widget_remove_css_class (entry, "error");
  if (numbers[i].optional && lamina_text_is_blank (text))
    {
      *value = NAN;
      return TRUE;
    }
  if (lamina_number_parse (numbers[i].field, text, value, &error))
    return TRUE;
  gtk_widget_add_css_class (entry, "error");
  lamina_material_row_show_error (self, error->message);
  gtk_widget_grab_focus (entry);
  return FALSE;
}

/* Stock thicknesses as typed: numbers in the locale's format (a decimal
 * comma in Danish), separated by blanks or semicolons. */
static gboolean
read_stock (LaminaMaterialRow *self,
            LaminaMaterial    *material)
{
  GtkWidget *entry = GTK_WIDGET (self->stock);
  g_auto(GStrv) items = g_strsplit_set (gtk_editable_get_text (GTK_EDITABLE (entry)), " \t;", -1);
  g_autoptr(GArray) values = g_array_new (FALSE, FALSE, sizeof (double));

  gtk_widget_remove_css_class (entry, "error");
  for (guint i = 0; items[i] != NULL; i++)
    {
      g_autoptr(GError) error = NULL;
      g_autofree char *message = NULL;
      double v;

      if (*items[i] == '\0')
        continue;
      if (!lamina_number_parse (LAMINA_FIELD_THICKNESS, items[i], &v, &error))
        {
          message = g_strdup_printf (_("Stock thicknesses: %s"), error->message);
          gtk_widget_add_css_class (entry, "error");
          lamina_material_row_show_error (self, message);
          gtk_widget_grab_focus (entry);
          return FALSE;
        }
      g_array_append_val (values, v);
    }
  lamina_material_set_stock_thicknesses (material, (double *) (void *) values->data, values->len);
  return TRUE;
}

static char *
dup_stock_text (const LaminaMaterial *material)
{
  GString *text = g_string_new (NULL);

  for (guint i = 0; i < material->n_stock_thicknesses; i++)
    {
      char d[LAMINA_FORMAT_SIZE];
      g_string_append_printf (text, "%s%s", i ? " " : "", lamina_format_thickness (d, material->stock_thicknesses[i]));
    }
  return g_string_free (text, FALSE);
}

static char *
dup_optional_text (GtkEntry *entry)
{
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));

  return lamina_text_is_blank (text) ? NULL : g_strdup (text);
}

LaminaMaterial *
lamina_material_row_dup_material (LaminaMaterialRow *self)
{
  g_autoptr(LaminaMaterial) copy = NULL;

  g_return_val_if_fail (LAMINA_IS_MATERIAL_ROW (self), NULL);

  copy = lamina_material_copy (self->material);
  for (guint i = 0; i < G_N_ELEMENTS (numbers); i++)
    if (!read_number (self, i, &NUMBER_VALUE (copy, i)))
      return NULL;
  if (!read_stock (self, copy))
    return NULL;
  if (lamina_text_is_blank (gtk_editable_get_text (GTK_EDITABLE (self->name))))
    {
      lamina_material_row_show_error (self, _("Name: a material needs a name"));
      return NULL;
    }
  g_free (copy->name);
  copy->name = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->name))));
  copy->category = (LaminaCategory) gtk_drop_down_get_selected (self->category);
  g_free (copy->source);
  copy->source = dup_optional_text (self->source);
  g_free (copy->notes);
  copy->notes = dup_optional_text (self->notes);
  return g_steal_pointer (&copy);
}

static void
on_save_clicked_cb (LaminaMaterialRow *self)
{
  g_signal_emit (self, signals[SAVE], 0);
}

static void
lamina_material_row_dispose (GObject *object)
{
  LaminaMaterialRow *self = LAMINA_MATERIAL_ROW (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_MATERIAL_ROW);
  g_clear_pointer (&self->material, lamina_material_free);

  G_OBJECT_CLASS (lamina_material_row_parent_class)->dispose (object);
}

static void
lamina_material_row_class_init (LaminaMaterialRowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_material_row_dispose;

  /* Save was pressed: the window reads the row and stores it. */
  signals[SAVE] = g_signal_new ("save", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                0, NULL, NULL, NULL, G_TYPE_NONE, 0);

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-material-row.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, category);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, name);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, lambda);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, save);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, density);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, heat);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, mu);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, emissivity);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, source);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, notes);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, stock);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialRow, error);
  gtk_widget_class_bind_template_callback (widget_class, on_save_clicked_cb);
}

static void
lamina_material_row_init (LaminaMaterialRow *self)
{
  g_autoptr(GtkStringList) names = gtk_string_list_new (NULL);

  gtk_widget_init_template (GTK_WIDGET (self));
  for (guint i = 0; i < LAMINA_N_CATEGORIES; i++)
    gtk_string_list_append (names, lamina_text_category_name ((LaminaCategory) i));
  gtk_drop_down_set_model (self->category, G_LIST_MODEL (names));
}

LaminaMaterialRow *
lamina_material_row_new (const LaminaMaterial *material)
{
  LaminaMaterialRow *self;

  g_return_val_if_fail (material != NULL, NULL);

  self = g_object_new (LAMINA_TYPE_MATERIAL_ROW, NULL);
  self->material = lamina_material_copy (material);
  gtk_drop_down_set_selected (self->category, (guint) material->category);
  gtk_editable_set_text (GTK_EDITABLE (self->name), material->name ? material->name : "");
  gtk_editable_set_text (GTK_EDITABLE (self->source), material->source ? material->source : "");
  gtk_editable_set_text (GTK_EDITABLE (self->notes), material->notes ? material->notes : "");
  {
    g_autofree char *stock = dup_stock_text (material);
    gtk_editable_set_text (GTK_EDITABLE (self->stock), stock);
  }
  for (guint i = 0; i < G_N_ELEMENTS (numbers); i++)
    {
      double value = NUMBER_VALUE (material, i);
      g_autofree char *text = isnan (value) ? g_strdup ("") : lamina_text_number (value, numbers[i].decimals);

      gtk_editable_set_text (GTK_EDITABLE (NUMBER_ENTRY (self, i)), text);
    }
  return self;
}
