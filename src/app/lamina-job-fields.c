/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-job-fields.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-error.h"
#include "lamina-library.h"

guint
lamina_job_fields_fill_revisions (GtkDropDown     *dropdown,
                                  GArray          *revisions,
                                  const GPtrArray *history,
                                  int              marked,
                                  const char      *mark,
                                  int              selected)
{
  g_autoptr(GtkStringList) labels = gtk_string_list_new (NULL);
  guint index = 0;

  g_array_set_size (revisions, 0);
  for (guint i = 0; history != NULL && i < history->len; i++)
    {
      const LaminaRevisionInfo *info = history->pdata[i];
      g_autofree char *label = g_strdup_printf (_("Revision %d — %s%s"), info->revision,
                                                lamina_status_to_string (info->status),
                                                info->revision == marked ? mark : "");

      g_array_append_val (revisions, info->revision);
      gtk_string_list_append (labels, label);
      if (info->revision == selected)
        index = i;
    }
  gtk_drop_down_set_model (dropdown, G_LIST_MODEL (labels));
  gtk_drop_down_set_selected (dropdown, index);
  return revisions->len;
}

char *
lamina_job_fields_dup_text (GtkEntry *entry)
{
  g_autofree char *text = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (entry))));

  return *text != '\0' ? g_steal_pointer (&text) : NULL;
}

void
lamina_job_fields_clear_mark (GtkEntry *entry)
{
  gtk_widget_remove_css_class (GTK_WIDGET (entry), "error");
}

gboolean
lamina_job_fields_refuse (GtkEntry    *entry,
                          const char  *label,
                          const char  *message,
                          GError     **error)
{
  g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID, "%s: %s", label, message);
  if (entry != NULL)
    {
      gtk_widget_add_css_class (GTK_WIDGET (entry), "error");
      gtk_widget_grab_focus (GTK_WIDGET (entry));
    }
  return FALSE;
}

gboolean
lamina_job_fields_parse (GtkEntry           *entry,
                         const char         *label,
                         LaminaNumberField   field,
                         gboolean            optional,
                         double             *value,
                         GError            **error)
{
  g_autofree char *text = lamina_job_fields_dup_text (entry);
  g_autoptr(GError) local = NULL;

  lamina_job_fields_clear_mark (entry);
  if (text == NULL && optional)
    {
      *value = NAN;
      return TRUE;
    }
  if (text == NULL)
    return lamina_job_fields_refuse (entry, label, _("a value is needed"), error);
  if (!lamina_number_parse (field, text, value, &local))
    return lamina_job_fields_refuse (entry, label, local->message, error);
  return TRUE;
}

void
lamina_job_fields_set_number (GtkEntry *entry,
                              double    value,
                              int       digits)
{
  char buffer[G_ASCII_DTOSTR_BUF_SIZE];

  if (isnan (value))
    {
      gtk_editable_set_text (GTK_EDITABLE (entry), "");
      return;
    }
  /* %g of the value rounded to @digits: no trailing zeros. */
  g_ascii_formatd (buffer, sizeof buffer, "%.10g", round (value * pow (10, digits)) / pow (10, digits));
  gtk_editable_set_text (GTK_EDITABLE (entry), buffer);
}
