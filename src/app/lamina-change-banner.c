/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-change-banner.c: "EW-101 was changed by … — Reload / Keep
 * editing" when a colleague saved or reviewed the open construction. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-change-banner-private.h"

#include <glib/gi18n.h>

G_DEFINE_FINAL_TYPE (LaminaChangeBanner, lamina_change_banner, GTK_TYPE_BOX)

/* What the library holds of @id now; FALSE when it cannot be read (a
 * busy library: try at the next change). */
static gboolean
read_state (LaminaLibrary      *library,
            const char         *id,
            LaminaChangeState  *state,
            GPtrArray         **history,
            GPtrArray         **events)
{
  g_autoptr(GPtrArray) h = lamina_library_dup_history (library, id, NULL);
  g_autoptr(GPtrArray) e = h ? lamina_library_dup_review_events (library, id, NULL) : NULL;
  const LaminaRevisionInfo *head;

  if (h == NULL || e == NULL || h->len == 0)
    return FALSE;
  head = h->pdata[0];
  state->head = head->revision;
  state->status = head->status;
  state->n_events = e->len;
  if (history != NULL)
    *history = g_steal_pointer (&h);
  if (events != NULL)
    *events = g_steal_pointer (&e);
  return TRUE;
}

static void
hide (LaminaChangeBanner *self)
{
  g_clear_pointer (&self->message, g_free);
  gtk_revealer_set_reveal_child (self->revealer, FALSE);
}

static void
remember (LaminaChangeBanner *self)
{
  LaminaChangeState state = { 0 };

  if (self->document != NULL
      && read_state (lamina_document_get_library (self->document),
                     lamina_document_get_id (self->document), &state, NULL, NULL))
    self->known = state;
}

/* "EW-101 was changed by Jory Pellan: revision 4 saved." and so on. */
static char *
describe (LaminaChangeBanner      *self,
          const LaminaChangeState *now,
          GPtrArray               *history,
          GPtrArray               *events)
{
  const LaminaConstruction *c = lamina_document_get_construction (self->document);
  const char *name = c->code != NULL && *c->code != '\0' ? c->code : c->name;
  const LaminaRevisionInfo *head = history->pdata[0];
  g_autofree char *what = NULL;
  const char *who = head->modified_by;

  if (now->head != self->known.head)
    what = g_strdup_printf (_("revision %d saved"), now->head);
  else if (now->n_events > self->known.n_events && events->len > 0)
    {
      const LaminaReviewEvent *e = events->pdata[events->len - 1];

      who = e->by;
      if (g_strcmp0 (e->act, "approved") == 0)
        what = g_strdup_printf (_("revision %d approved"), e->revision);
      else if (g_strcmp0 (e->act, "withdrawn") == 0)
        what = g_strdup_printf (_("approval of revision %d withdrawn"), e->revision);
      else
        what = g_strdup_printf (_("revision %d checked"), e->revision);
    }
  else
    what = g_strdup_printf (_("revision %d is now %s"), now->head, lamina_status_to_string (now->status));
  /* TRANSLATORS: "EW-101 was changed by Jory Pellan: revision 4 saved." */
  return g_strdup_printf (_("%s was changed by %s: %s. Your version stays on screen until you reload."),
                          name, who ? who : _("someone else"), what);
}

/* Deleted by another connection: the history stays, the construction is
 * no longer found. */
static gboolean
is_deleted (LaminaChangeBanner *self)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaConstruction) c =
    lamina_library_dup_construction (lamina_document_get_library (self->document),
                                     lamina_document_get_id (self->document), 0, &error);

  return c == NULL && g_error_matches (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
}

void
lamina_change_banner_library_changed (LaminaChangeBanner *self,
                                      gboolean            external)
{
  g_autoptr(GPtrArray) history = NULL;
  g_autoptr(GPtrArray) events = NULL;
  LaminaChangeState now = { 0 };

  g_return_if_fail (LAMINA_IS_CHANGE_BANNER (self));

  if (self->document == NULL
      || !read_state (lamina_document_get_library (self->document),
                      lamina_document_get_id (self->document), &now, &history, &events))
    return;
  if (external && self->known.head > 0 && is_deleted (self))
    {
      const LaminaConstruction *c = lamina_document_get_construction (self->document);

      g_free (self->message);
      self->message = g_strdup_printf (_("%s was deleted from the library by someone else. Your version "
                                         "stays on screen; it is no longer in the library."),
                                       c->code != NULL && *c->code != '\0' ? c->code : c->name);
      gtk_label_set_text (self->label, self->message);
      gtk_widget_set_visible (GTK_WIDGET (self->reload_button), FALSE);
      gtk_revealer_set_reveal_child (self->revealer, TRUE);
      self->known.head = 0;
      return;
    }
  if (external && self->known.head > 0
      && (now.head != self->known.head || now.status != self->known.status
          || now.n_events != self->known.n_events))
    {
      g_free (self->message);
      self->message = describe (self, &now, history, events);
      gtk_label_set_text (self->label, self->message);
      gtk_widget_set_visible (GTK_WIDGET (self->reload_button), TRUE);
      gtk_revealer_set_reveal_child (self->revealer, TRUE);
    }
  /* Shown once per change: "Keep editing" does not bring it back. */
  self->known = now;
}

void
lamina_change_banner_set_document (LaminaChangeBanner *self,
                                   LaminaDocument     *document)
{
  g_return_if_fail (LAMINA_IS_CHANGE_BANNER (self));

  g_set_object (&self->document, document);
  self->known = (LaminaChangeState) { 0 };
  hide (self);
  remember (self);
}

const char *
lamina_change_banner_get_message (LaminaChangeBanner *self)
{
  g_return_val_if_fail (LAMINA_IS_CHANGE_BANNER (self), NULL);
  return self->message;
}

static void
on_reload_clicked_cb (LaminaChangeBanner *self)
{
  g_autoptr(GError) error = NULL;

  if (self->document == NULL)
    return;
  if (!lamina_document_reload (self->document, &error))
    {
      gtk_label_set_text (self->label, error->message);
      return;
    }
  hide (self);
  remember (self);
}

static void
on_keep_clicked_cb (LaminaChangeBanner *self)
{
  hide (self);
}

static void
lamina_change_banner_dispose (GObject *object)
{
  LaminaChangeBanner *self = LAMINA_CHANGE_BANNER (object);

  g_clear_object (&self->document);
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_CHANGE_BANNER);
  G_OBJECT_CLASS (lamina_change_banner_parent_class)->dispose (object);
}

static void
lamina_change_banner_finalize (GObject *object)
{
  g_free (LAMINA_CHANGE_BANNER (object)->message);
  G_OBJECT_CLASS (lamina_change_banner_parent_class)->finalize (object);
}

static void
lamina_change_banner_class_init (LaminaChangeBannerClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_change_banner_dispose;
  object_class->finalize = lamina_change_banner_finalize;
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-change-banner.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaChangeBanner, revealer);
  gtk_widget_class_bind_template_child (widget_class, LaminaChangeBanner, label);
  gtk_widget_class_bind_template_child (widget_class, LaminaChangeBanner, reload_button);
  gtk_widget_class_bind_template_child (widget_class, LaminaChangeBanner, keep_button);
}

static void
lamina_change_banner_init (LaminaChangeBanner *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  g_signal_connect_object (self->reload_button, "clicked", G_CALLBACK (on_reload_clicked_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->keep_button, "clicked", G_CALLBACK (on_keep_clicked_cb), self, G_CONNECT_SWAPPED);
}

GtkWidget *
lamina_change_banner_new (void)
{
  return g_object_new (LAMINA_TYPE_CHANGE_BANNER, NULL);
}
