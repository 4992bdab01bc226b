/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-parts-dialog-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-editor-state.h"
#include "lamina-number.h"
#include "lamina-text.h"

typedef enum
{
  MODE_FRACTION,
  MODE_FRAMING,
  MODE_REMAINDER,
} Mode;

G_DEFINE_FINAL_TYPE (LaminaPartsDialog, lamina_parts_dialog, GTK_TYPE_WINDOW)

static void update (LaminaPartsDialog *d);

static void
row_free (LaminaPartsRow *row)
{
  g_ptr_array_unref (row->options);
  g_free (row);
}

static const LaminaLayer *
get_layer (LaminaPartsDialog *d)
{
  const LaminaConstruction *state = lamina_document_get_construction (d->document);

  if (d->layer >= state->layers->len)
    return NULL;
  return g_ptr_array_index (state->layers, d->layer);
}

static Mode
part_mode (const LaminaPart *part)
{
  if (!isnan (part->fraction))
    return MODE_FRACTION;
  if (!isnan (part->width) || !isnan (part->spacing))
    return MODE_FRAMING;
  return MODE_REMAINDER;
}

/* Applies a pure edit; a refused one is shown under the part's row. */
static void
row_apply (LaminaPartsRow     *row,
           LaminaConstruction *next,
           const GError       *error)
{
  if (next == NULL)
    {
      gtk_label_set_text (row->error, error ? error->message : "");
      gtk_widget_set_visible (GTK_WIDGET (row->error), TRUE);
      return;
    }
  lamina_document_apply (row->dialog->document, next, NULL, LAMINA_APPLY_DEFAULT);
}

static const LaminaConstruction *
row_state (LaminaPartsRow *row)
{
  return lamina_document_get_construction (row->dialog->document);
}

static void
on_material_selected_cb (LaminaPartsRow *row)
{
  guint selected = gtk_drop_down_get_selected (row->material);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;

  if (row->dialog->updating || selected >= row->options->len)
    return;
  next = lamina_edit_set_part_material (row_state (row), row->dialog->layer, row->part,
                                        g_ptr_array_index (row->options, selected), &error);
  row_apply (row, next, error);
}

static void
on_mode_selected_cb (LaminaPartsRow *row)
{
  const LaminaLayer *layer = get_layer (row->dialog);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next = NULL;
  double f;

  if (row->dialog->updating || layer == NULL || row->part >= layer->parts->len)
    return;
  f = lamina_layer_get_part_fraction (layer, row->part);
  if (!(f > 0 && f < 1))
    f = 0.1;
  switch ((Mode) gtk_drop_down_get_selected (row->mode))
    {
    case MODE_FRACTION:
      next = lamina_edit_set_part_fraction (row_state (row), row->dialog->layer, row->part, f, &error);
      break;
    case MODE_FRAMING:
      /* A common softwood stud width (common practice), at the spacing
       * that keeps the part's share. */
      next = lamina_edit_set_part_framing (row_state (row), row->dialog->layer, row->part,
                                           45, round (45 / f), &error);
      break;
    case MODE_REMAINDER:
    default:
      next = lamina_edit_set_part_remainder (row_state (row), row->dialog->layer, row->part, &error);
      break;
    }
  row_apply (row, next, error);
}

static gboolean
parse_entry (LaminaPartsRow    *row,
             GtkEntry          *entry,
             LaminaNumberField  field,
             double            *value)
{
  g_autoptr(GError) error = NULL;

  if (lamina_number_parse (field, gtk_editable_get_text (GTK_EDITABLE (entry)), value, &error))
    {
      gtk_widget_remove_css_class (GTK_WIDGET (entry), "error");
      return TRUE;
    }
  gtk_widget_add_css_class (GTK_WIDGET (entry), "error");
  row_apply (row, NULL, error);
  return FALSE;
}

static void
on_fraction_commit_cb (LaminaPartsRow *row)
{
  const LaminaLayer *layer = get_layer (row->dialog);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;
  double percent;

  if (row->dialog->updating || layer == NULL || row->part >= layer->parts->len ||
      part_mode (layer->parts->pdata[row->part]) != MODE_FRACTION)
    return;
  if (!parse_entry (row, row->fraction, LAMINA_FIELD_PERCENTAGE, &percent))
    return;
  if (fabs (percent / 100.0 - ((LaminaPart *) layer->parts->pdata[row->part])->fraction) < 1e-12)
    return;
  next = lamina_edit_set_part_fraction (row_state (row), row->dialog->layer, row->part, percent / 100.0, &error);
  row_apply (row, next, error);
}

static void
on_framing_commit_cb (LaminaPartsRow *row)
{
  const LaminaLayer *layer = get_layer (row->dialog);
  g_autoptr(GError) error = NULL;
  const LaminaPart *part;
  LaminaConstruction *next;
  double width, spacing;

  if (row->dialog->updating || layer == NULL || row->part >= layer->parts->len)
    return;
  part = layer->parts->pdata[row->part];
  if (part_mode (part) != MODE_FRAMING ||
      !parse_entry (row, row->width, LAMINA_FIELD_WIDTH, &width) ||
      !parse_entry (row, row->spacing, LAMINA_FIELD_SPACING, &spacing))
    return;
  if (width == part->width && spacing == part->spacing)
    return;
  next = lamina_edit_set_part_framing (row_state (row), row->dialog->layer, row->part, width, spacing, &error);
  row_apply (row, next, error);
}

static void
on_member_commit_cb (LaminaPartsRow *row)
{
  const LaminaLayer *layer = get_layer (row->dialog);
  const char *text = gtk_editable_get_text (GTK_EDITABLE (row->member));
  g_autoptr(GError) error = NULL;
  const LaminaPart *part;
  LaminaConstruction *next;

  if (row->dialog->updating || layer == NULL || row->part >= layer->parts->len)
    return;
  part = layer->parts->pdata[row->part];
  if (g_strcmp0 (text, part->member ? part->member : "") == 0)
    return;
  next = lamina_edit_set_part_member (row_state (row), row->dialog->layer, row->part, text, &error);
  row_apply (row, next, error);
}

static void
on_remove_clicked_cb (LaminaPartsRow *row)
{
  g_autoptr(GError) error = NULL;
  LaminaConstruction *next;

  next = lamina_edit_remove_part (row_state (row), row->dialog->layer, row->part, &error);
  row_apply (row, next, error);
}

/* Commits an entry on Enter and when focus leaves it. */
static GtkEntry *
new_entry (LaminaPartsRow *row,
           int             width,
           const char     *accessible,
           GCallback       commit)
{
  GtkWidget *entry = gtk_entry_new ();
  GtkEventController *focus = gtk_event_controller_focus_new ();

  gtk_editable_set_width_chars (GTK_EDITABLE (entry), width);
  gtk_editable_set_max_width_chars (GTK_EDITABLE (entry), width);
  gtk_accessible_update_property (GTK_ACCESSIBLE (entry), GTK_ACCESSIBLE_PROPERTY_LABEL, accessible, -1);
  g_signal_connect_swapped (entry, "activate", commit, row);
  g_signal_connect_swapped (focus, "leave", commit, row);
  gtk_widget_add_controller (entry, focus);
  return GTK_ENTRY (entry);
}

static GtkWidget *
new_caption (const char *text)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_widget_add_css_class (label, "dim-label");
  return label;
}

/* The choices of material: air, the part's own data when the library has
 * no material with its id, then the library. */
static GtkDropDown *
new_material_dropdown (LaminaPartsRow   *row,
                       const LaminaPart *part)
{
  g_autoptr(GtkStringList) names = gtk_string_list_new (NULL);
  gboolean in_library = FALSE;
  g_autoptr(GtkExpression) expression = NULL;
  GtkWidget *dropdown;

  row->options = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_material_free);
  g_ptr_array_add (row->options, NULL);
  gtk_string_list_append (names, _("Air (cavity between members)"));
  for (guint i = 0; part->material != NULL && i < row->dialog->materials->len; i++)
    in_library |= g_strcmp0 (((LaminaMaterial *) row->dialog->materials->pdata[i])->id, part->material->id) == 0;
  if (part->material != NULL && !in_library)
    {
      g_ptr_array_add (row->options, lamina_material_copy (part->material));
      gtk_string_list_append (names, part->material->name);
    }
  for (guint i = 0; i < row->dialog->materials->len; i++)
    {
      const LaminaMaterial *material = row->dialog->materials->pdata[i];
      g_autofree char *lambda = lamina_text_number (material->conductivity, 3);
      g_autofree char *text = g_strdup_printf ("%s (λ %s)", material->name, lambda);

      g_ptr_array_add (row->options, lamina_material_copy (material));
      gtk_string_list_append (names, text);
    }
  /* set_expression takes its own reference: ours is dropped here. */
  expression = gtk_property_expression_new (GTK_TYPE_STRING_OBJECT, NULL, "string");
  dropdown = gtk_drop_down_new (G_LIST_MODEL (g_steal_pointer (&names)), NULL);
  gtk_drop_down_set_enable_search (GTK_DROP_DOWN (dropdown), TRUE);
  gtk_drop_down_set_expression (GTK_DROP_DOWN (dropdown), expression);
  gtk_widget_set_hexpand (dropdown, TRUE);
  gtk_accessible_update_property (GTK_ACCESSIBLE (dropdown), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Material of the part"), -1);
  g_signal_connect_swapped (dropdown, "notify::selected", G_CALLBACK (on_material_selected_cb), row);
  return GTK_DROP_DOWN (dropdown);
}

static LaminaPartsRow *
new_row (LaminaPartsDialog *d,
         guint              index,
         const LaminaPart  *part)
{
  const char *modes[] = { N_("Fraction"), N_("Width at spacing"), N_("Remainder"), NULL };
  g_autoptr(GtkStringList) mode_names = gtk_string_list_new (NULL);
  LaminaPartsRow *row = g_new0 (LaminaPartsRow, 1);
  GtkWidget *line = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  g_autofree char *number = g_strdup_printf ("%u", index + 1);
  GtkWidget *badge = gtk_label_new (number);

  row->dialog = d;
  row->part = index;
  row->box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 2);
  row->material = new_material_dropdown (row, part);
  for (guint i = 0; modes[i]; i++)
    gtk_string_list_append (mode_names, _(modes[i]));
  row->mode = GTK_DROP_DOWN (gtk_drop_down_new (G_LIST_MODEL (g_steal_pointer (&mode_names)), NULL));
  gtk_widget_set_tooltip_text (GTK_WIDGET (row->mode),
                               _("How the part's share of the area is given: as a fraction, as member width at centre spacing, or as what the other parts leave (one part per layer)"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (row->mode), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("How the share is given"), -1);
  g_signal_connect_swapped (row->mode, "notify::selected", G_CALLBACK (on_mode_selected_cb), row);

  row->fraction_box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 4);
  row->fraction = new_entry (row, 5, _("Area fraction in per cent"), G_CALLBACK (on_fraction_commit_cb));
  gtk_box_append (GTK_BOX (row->fraction_box), GTK_WIDGET (row->fraction));
  gtk_box_append (GTK_BOX (row->fraction_box), new_caption ("%"));
  row->framing_box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 4);
  row->width = new_entry (row, 4, _("Member width in mm"), G_CALLBACK (on_framing_commit_cb));
  row->spacing = new_entry (row, 5, _("Centre spacing in mm"), G_CALLBACK (on_framing_commit_cb));
  gtk_box_append (GTK_BOX (row->framing_box), GTK_WIDGET (row->width));
  /* Translators: between a member width and its centre spacing, "45 mm at 600 mm". */
  gtk_box_append (GTK_BOX (row->framing_box), new_caption (_("mm at")));
  gtk_box_append (GTK_BOX (row->framing_box), GTK_WIDGET (row->spacing));
  gtk_box_append (GTK_BOX (row->framing_box), new_caption ("mm"));
  row->remainder = GTK_LABEL (new_caption (NULL));
  row->member = new_entry (row, 10, _("Framing member name"), G_CALLBACK (on_member_commit_cb));
  gtk_entry_set_placeholder_text (row->member, _("e.g. stud"));
  gtk_widget_set_tooltip_text (GTK_WIDGET (row->member),
                               _("Name of the framing member (stud, nogging, batten). Parts of different layers with the same member name line up through the construction. The infill has no name."));
  row->remove = gtk_button_new_from_icon_name ("list-remove-symbolic");
  gtk_widget_set_tooltip_text (row->remove, _("Remove Part"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (row->remove), GTK_ACCESSIBLE_PROPERTY_LABEL, _("Remove Part"), -1);
  g_signal_connect_swapped (row->remove, "clicked", G_CALLBACK (on_remove_clicked_cb), row);
  row->error = GTK_LABEL (gtk_label_new (NULL));
  gtk_label_set_wrap (row->error, TRUE);
  gtk_label_set_xalign (row->error, 0);
  gtk_widget_set_margin_start (GTK_WIDGET (row->error), 28);
  gtk_widget_add_css_class (GTK_WIDGET (row->error), "lamina-error");
  gtk_widget_add_css_class (GTK_WIDGET (row->error), "caption");

  gtk_widget_set_size_request (badge, 20, -1);
  gtk_widget_add_css_class (badge, "dim-label");
  gtk_box_append (GTK_BOX (line), badge);
  gtk_box_append (GTK_BOX (line), GTK_WIDGET (row->material));
  gtk_box_append (GTK_BOX (line), GTK_WIDGET (row->mode));
  gtk_box_append (GTK_BOX (line), row->fraction_box);
  gtk_box_append (GTK_BOX (line), row->framing_box);
  gtk_box_append (GTK_BOX (line), GTK_WIDGET (row->remainder));
  gtk_box_append (GTK_BOX (line), GTK_WIDGET (row->member));
  gtk_box_append (GTK_BOX (line), row->remove);
  gtk_box_append (GTK_BOX (row->box), line);
  gtk_box_append (GTK_BOX (row->box), GTK_WIDGET (row->error));
  return row;
}

static void
set_entry_number (GtkEntry *entry,
                  double    value,
                  int       decimals)
{
  g_autofree char *text = NULL;

  if (gtk_widget_has_focus (GTK_WIDGET (entry)) || gtk_widget_is_focus (GTK_WIDGET (entry)))
    return;
  text = isnan (value) ? g_strdup ("") : lamina_text_number (value, decimals);
  gtk_editable_set_text (GTK_EDITABLE (entry), text);
  gtk_widget_remove_css_class (GTK_WIDGET (entry), "error");
}

/* FALSE when the row's choices of material no longer hold the part's. */
static gboolean
update_row (LaminaPartsRow    *row,
            const LaminaLayer *layer)
{
  const LaminaPart *part = layer->parts->pdata[row->part];
  Mode mode = part_mode (part);
  guint material = G_MAXUINT;
  g_autofree char *rest = NULL;
  g_autofree char *rest_text = NULL;

  for (guint i = 0; i < row->options->len && material == G_MAXUINT; i++)
    {
      const LaminaMaterial *option = row->options->pdata[i];

      if ((option == NULL && part->material == NULL) ||
          (option != NULL && lamina_material_equal (option, part->material)))
        material = i;
    }
  if (material == G_MAXUINT)
    return FALSE;
  gtk_drop_down_set_selected (row->material, material);
  gtk_drop_down_set_selected (row->mode, mode);
  gtk_widget_set_visible (row->fraction_box, mode == MODE_FRACTION);
  gtk_widget_set_visible (row->framing_box, mode == MODE_FRAMING);
  gtk_widget_set_visible (GTK_WIDGET (row->remainder), mode == MODE_REMAINDER);
  set_entry_number (row->fraction, part->fraction * 100.0, 1);
  set_entry_number (row->width, part->width, 0);
  set_entry_number (row->spacing, part->spacing, 0);
  rest = lamina_text_number (lamina_layer_get_part_fraction (layer, row->part) * 100.0, 1);
  /* Translators: the share the remainder part takes, "the rest: 92.5 %". */
  rest_text = g_strdup_printf (_("the rest: %s %%"), rest);
  gtk_label_set_text (row->remainder, rest_text);
  if (!gtk_widget_has_focus (GTK_WIDGET (row->member)) && !gtk_widget_is_focus (GTK_WIDGET (row->member)))
    gtk_editable_set_text (GTK_EDITABLE (row->member), part->member ? part->member : "");
  gtk_widget_set_sensitive (row->remove, layer->parts->len > 1);
  gtk_label_set_text (row->error, "");
  gtk_widget_set_visible (GTK_WIDGET (row->error), FALSE);
  return TRUE;
}

static gboolean
is_valid (const LaminaConstruction *c)
{
  return lamina_construction_validate (c, NULL, NULL);
}

/* Which part of layer @index the validation error of @state is about: a
 * part index, −1 for the layer as a whole, −2 when it is not this layer.
 * The core names the place in its message; this only finds the row to
 * show it beside, by checking each part on its own (with an air remainder
 * beside it) in place of the layer. */
static int
locate_error (const LaminaConstruction *state,
              guint                     index)
{
  const LaminaLayer *layer = g_ptr_array_index (state->layers, index);
  g_autoptr(LaminaConstruction) probe = lamina_construction_copy (state);
  LaminaLayer *plain = lamina_layer_new_material (layer->thickness, lamina_material_new (NULL, "probe", LAMINA_CATEGORY_OTHER, 1.0));

  lamina_layer_free (probe->layers->pdata[index]);
  probe->layers->pdata[index] = plain;
  if (!is_valid (probe))
    return -2;
  for (guint p = 0; p < layer->parts->len; p++)
    {
      const LaminaPart *part = layer->parts->pdata[p];
      LaminaLayer *alone = lamina_layer_new_bridged (layer->thickness);
      double f = lamina_part_get_given_fraction (part);

      lamina_layer_add_part (alone, lamina_part_copy (part));
      if (f > 0 && f < 1)
        lamina_layer_add_part (alone, lamina_part_new (NULL, NAN));
      lamina_layer_free (probe->layers->pdata[index]);
      probe->layers->pdata[index] = alone;
      if (!is_valid (probe))
        return (int) p;
    }
  return -1;
}

static void
show_validation (LaminaPartsDialog *d)
{
  const LaminaConstruction *state = lamina_document_get_construction (d->document);
  g_autoptr(GError) error = NULL;
  int where;

  gtk_widget_set_visible (GTK_WIDGET (d->layer_error), FALSE);
  if (lamina_construction_validate (state, NULL, &error))
    return;
  where = locate_error (state, d->layer);
  if (where >= 0 && (guint) where < d->rows->len)
    {
      LaminaPartsRow *row = d->rows->pdata[where];

      gtk_label_set_text (row->error, error->message);
      gtk_widget_set_visible (GTK_WIDGET (row->error), TRUE);
    }
  else if (where == -1)
    {
      gtk_label_set_text (d->layer_error, error->message);
      gtk_widget_set_visible (GTK_WIDGET (d->layer_error), TRUE);
    }
}

static void
rebuild (LaminaPartsDialog *d,
         const LaminaLayer *layer)
{
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (d->rows_box))) != NULL)
    gtk_box_remove (d->rows_box, child);
  g_ptr_array_set_size (d->rows, 0);
  for (guint i = 0; i < layer->parts->len; i++)
    {
      LaminaPartsRow *row = new_row (d, i, layer->parts->pdata[i]);

      g_ptr_array_add (d->rows, row);
      gtk_box_append (d->rows_box, row->box);
    }
}

static void
update (LaminaPartsDialog *d)
{
  const LaminaLayer *layer = get_layer (d);
  gboolean ok = TRUE;

  if (layer == NULL || layer->kind != LAMINA_LAYER_BRIDGED)
    {
      /* Undone past the making of the bridged layer: nothing to edit. */
      gtk_window_destroy (GTK_WINDOW (d));
      return;
    }
  d->updating = TRUE;
  if (d->rows->len != layer->parts->len)
    rebuild (d, layer);
  for (guint i = 0; i < d->rows->len && ok; i++)
    ok = update_row (d->rows->pdata[i], layer);
  if (!ok)
    {
      rebuild (d, layer);
      for (guint i = 0; i < d->rows->len; i++)
        update_row (d->rows->pdata[i], layer);
    }
  d->updating = FALSE;
  show_validation (d);
}

static void
on_add_clicked_cb (LaminaPartsDialog *d)
{
  const LaminaLayer *layer = get_layer (d);
  const LaminaMaterial *material = d->materials->len ? d->materials->pdata[0] : NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *member = NULL;
  LaminaConstruction *next;

  if (layer == NULL)
    return;
  /* Most added parts are another framing member (a nogging, a batten):
   * timber at a small share, named so it is told apart from the infill. */
  for (guint i = 0; i < d->materials->len; i++)
    if (((LaminaMaterial *) d->materials->pdata[i])->category == LAMINA_CATEGORY_TIMBER)
      {
        material = d->materials->pdata[i];
        break;
      }
  member = g_strdup_printf (_("framing %u"), layer->parts->len + 1);
  next = lamina_edit_add_part (lamina_document_get_construction (d->document), d->layer,
                               material, 0.05, member, &error);
  if (next == NULL)
    {
      gtk_label_set_text (d->layer_error, error->message);
      gtk_widget_set_visible (GTK_WIDGET (d->layer_error), TRUE);
      return;
    }
  lamina_document_apply (d->document, next, NULL, LAMINA_APPLY_DEFAULT);
}

static void
lamina_parts_dialog_dispose (GObject *object)
{
  LaminaPartsDialog *d = LAMINA_PARTS_DIALOG (object);

  if (d->document != NULL)
    g_clear_signal_handler (&d->changed_id, d->document);
  gtk_widget_dispose_template (GTK_WIDGET (d), LAMINA_TYPE_PARTS_DIALOG);
  g_clear_pointer (&d->rows, g_ptr_array_unref);
  g_clear_pointer (&d->materials, g_ptr_array_unref);
  g_clear_object (&d->document);

  G_OBJECT_CLASS (lamina_parts_dialog_parent_class)->dispose (object);
}

static void
lamina_parts_dialog_class_init (LaminaPartsDialogClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_parts_dialog_dispose;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-parts-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaPartsDialog, rows_box);
  gtk_widget_class_bind_template_child (widget_class, LaminaPartsDialog, layer_error);
  gtk_widget_class_bind_template_child (widget_class, LaminaPartsDialog, add);
  gtk_widget_class_bind_template_callback (widget_class, on_add_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, gtk_window_destroy);
}

static void
lamina_parts_dialog_init (LaminaPartsDialog *d)
{
  gtk_widget_init_template (GTK_WIDGET (d));
  d->rows = g_ptr_array_new_with_free_func ((GDestroyNotify) row_free);
}

LaminaPartsDialog *
lamina_parts_dialog_new (GtkWindow      *parent,
                         LaminaDocument *document,
                         guint           index)
{
  g_autofree char *title = g_strdup_printf (_("Parts of Layer %u"), index + 1);
  LaminaPartsDialog *d;

  g_return_val_if_fail (LAMINA_IS_DOCUMENT (document), NULL);

  d = g_object_new (LAMINA_TYPE_PARTS_DIALOG, "title", title, "transient-for", parent, NULL);
  d->document = g_object_ref (document);
  d->layer = index;
  d->materials = lamina_library_list_materials (lamina_document_get_library (d->document), NULL);
  if (d->materials == NULL)
    d->materials = g_ptr_array_new ();
  d->changed_id = g_signal_connect_swapped (d->document, "changed", G_CALLBACK (update), d);
  update (d);
  return d;
}

GtkWindow *
lamina_parts_dialog_present (GtkWindow      *parent,
                             LaminaDocument *document,
                             guint           index)
{
  GtkWindow *window = GTK_WINDOW (lamina_parts_dialog_new (parent, document, index));

  gtk_window_present (window);
  return window;
}
