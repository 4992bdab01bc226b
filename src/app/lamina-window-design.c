/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-window-design.c: the window's design aids.  "Thinnest That Meet
 * the Target" filters the library to the open construction's element and
 * target U, thinnest first (the store's own search); "Compare" sets two
 * build-ups side by side: the edited state against the approved revision,
 * or against any construction typed in. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-window-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-compare-window.h"
#include "lamina-text.h"

/* The sort drop-down's entry for thickness (lamina-window.c). */
#define SORT_THICKNESS 3

void
lamina_window_show_meeting (LaminaWindow  *self,
                            LaminaElement  element,
                            double         target)
{
  g_autofree char *text = NULL;

  g_return_if_fail (LAMINA_IS_WINDOW (self));

  text = lamina_text_number (target, 3);
  gtk_editable_set_text (GTK_EDITABLE (self->min_u_entry), "");
  gtk_editable_set_text (GTK_EDITABLE (self->max_u_entry), text);
  gtk_drop_down_set_selected (self->element_filter, (guint) element + 1);
  gtk_drop_down_set_selected (self->sort_dropdown, SORT_THICKNESS);
}

static const LaminaConstruction *
open_construction (LaminaWindow *self)
{
  return self->document ? lamina_document_get_construction (self->document) : NULL;
}

static void
meets_target_action (GtkWidget  *widget,
                     const char *name,
                     GVariant   *parameter)
{
  LaminaWindow *self = LAMINA_WINDOW (widget);
  const LaminaConstruction *c = open_construction (self);

  if (c == NULL)
    return;
  /* The construction's own target, else its current U: "as good, thinner". */
  if (!isnan (c->target_u))
    lamina_window_show_meeting (self, c->element, c->target_u);
  else
    {
      g_autoptr(LaminaResult) r = lamina_calculate (c, NULL);
      if (r != NULL)
        lamina_window_show_meeting (self, c->element, r->u_corrected);
    }
}

/* The latest approved revision before the open state, or NULL. */
static LaminaConstruction *
dup_approved (LaminaWindow             *self,
              const LaminaConstruction *c)
{
  g_autoptr(GPtrArray) history = lamina_library_dup_history (self->library, c->id, NULL);

  for (guint i = 0; history != NULL && i < history->len; i++)
    {
      const LaminaRevisionInfo *info = history->pdata[i];

      if (info->status == LAMINA_STATUS_APPROVED)
        return lamina_library_dup_construction (self->library, c->id, info->revision, NULL);
    }
  return NULL;
}

LaminaCompareWindow *
lamina_window_compare (LaminaWindow *self,
                       gboolean      with_approved)
{
  const LaminaConstruction *c = open_construction (self);
  g_autoptr(LaminaConstruction) approved = NULL;
  g_autofree char *label_a = NULL;
  LaminaCompareWindow *window;

  g_return_val_if_fail (LAMINA_IS_WINDOW (self), NULL);

  if (c == NULL)
    return NULL;
  if (with_approved && (approved = dup_approved (self, c)) != NULL)
    {
      /* A is what was approved, B the edit: B − A is what the edit changes. */
      g_autofree char *label = g_strdup_printf (_("approved revision %d"), approved->revision);
      window = lamina_compare_window_new (GTK_WINDOW (self), self->library, approved, label, c, _("as edited"));
    }
  else
    {
      label_a = g_strdup_printf (_("revision %d as edited"), c->revision);
      window = lamina_compare_window_new (GTK_WINDOW (self), self->library, c, label_a, NULL, NULL);
    }
  gtk_window_present (GTK_WINDOW (window));
  return window;
}

static void
compare_action (GtkWidget  *widget,
                const char *name,
                GVariant   *parameter)
{
  lamina_window_compare (LAMINA_WINDOW (widget), g_str_equal (name, "win.compare-approved"));
}

void
lamina_window_install_design_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.meets-target", NULL, meets_target_action);
  gtk_widget_class_install_action (widget_class, "win.compare", NULL, compare_action);
  gtk_widget_class_install_action (widget_class, "win.compare-approved", NULL, compare_action);
}
