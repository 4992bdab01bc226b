/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Target sets and jobs in the catalogue XML:
 *
 *   <target-set id= name= source=>
 *     <notes>…</notes>
 *     <target use= max-u= [label=] [element=] [min-frsi=] [moisture=] [ground=]/>
 *   </target-set>
 *   <job id= name= [number=] [client=] [architect=] [status=] [target-set=]
 *        [inside-temperature=] [outside-temperature=] [climate=]
 *        [ground-area=] [ground-perimeter=] [ground-b-prime=] [modified-at=]>
 *     <site>…</site> <notes>…</notes>
 *     <entry n= construction= revision= use= [area=] [origin= origin-revision=]>
 *       <location>…</location>
 *     </entry>
 *     <junction n= name= psi= length=/>
 *     <event at= by= text=/>
 *   </job>
 *
 * Target sets come after the materials (and climates) and before the
 * constructions; jobs after the constructions they name.  Ids are unique
 * in a document; every set and job is checked by the model's rules. */
#define G_LOG_DOMAIN "lamina-exchange"

#include "lamina-catalogue-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "lamina-error.h"

typedef const LaminaXmlSource Source;

/* Every fault here breaks a rule of the model. */
#define fail(s, line, ...) lamina_xml_fail ((s), (line), LAMINA_XML_ERROR_INVALID, __VA_ARGS__)
#define get_number(s, node, attr, value) lamina_xml_get_number ((s), (node), (attr), (value))
/* Entries, revisions and junctions count from 1. */
#define get_count(s, node, attr, value) \
  lamina_xml_get_count ((s), (node), (attr), 1, G_MAXINT, (value))

static void
replace (char **field,
         char  *value)
{
  g_free (*field);
  *field = value;
}

/* Target sets */

static gboolean
read_target (Source          *s,
             xmlNode         *node,
             LaminaTargetSet *set)
{
  g_autoptr(LaminaTarget) t = lamina_target_new (NULL, NAN);
  g_autofree char *element = lamina_xml_dup_attr (node, "element");
  g_autofree char *moisture = lamina_xml_dup_attr (node, "moisture");
  g_autofree char *ground = lamina_xml_dup_attr (node, "ground");
  LaminaElement kind;

  t->line = lamina_xml_node_get_line (node);
  t->use = lamina_xml_dup_attr (node, "use");
  t->label = lamina_xml_dup_attr (node, "label");
  if (!get_number (s, node, "max-u", &t->max_u) || !get_number (s, node, "min-frsi", &t->min_frsi))
    return FALSE;
  if (element != NULL)
    {
      if (!lamina_element_from_string (element, &kind))
        return fail (s, t->line, _("element=“%s” is not one of the allowed names"), element);
      t->element = (int) kind;
    }
  if (moisture != NULL && !lamina_moisture_criterion_from_string (moisture, &t->moisture))
    return fail (s, t->line, _("moisture=“%s” is not one of the allowed names"), moisture);
  t->ground = g_strcmp0 (ground, "true") == 0 || g_strcmp0 (ground, "1") == 0;
  lamina_target_set_add (set, g_steal_pointer (&t));
  return TRUE;
}

gboolean
lamina_catalogue_read_target_set (LaminaCatalogue        *catalogue,
                                  xmlNode                *node,
                                  const LaminaXmlSource  *source)
{
  Source *s = source;
  g_autofree char *id = lamina_xml_dup_attr (node, "id");
  g_autoptr(LaminaTargetSet) set = lamina_target_set_new (id, NULL);
  LaminaTargetSet *known = lamina_catalogue_find_target_set (catalogue, id);
  g_autoptr(GError) local = NULL;
  int line = 0;

  set->line = lamina_xml_node_get_line (node);
  if (known != NULL)
    return fail (s, set->line, _("target set id “%s” is used twice (first on line %d)"),
                 id, known->line);
  set->name = lamina_xml_dup_attr (node, "name");
  set->source = lamina_xml_dup_attr (node, "source");
  for (xmlNode *child = node->children; child != NULL; child = child->next)
    {
      if (lamina_xml_is_element (child, "notes"))
        replace (&set->notes, lamina_xml_dup_text (child));
      else if (lamina_xml_is_element (child, "target") && !read_target (s, child, set))
        return FALSE;
    }
  if (!lamina_target_set_validate (set, &line, &local))
    return fail (s, line > 0 ? line : set->line, "%s", local->message);
  g_ptr_array_add (catalogue->target_sets, g_steal_pointer (&set));
  return TRUE;
}

/* Jobs */

static gboolean
read_entry (Source    *s,
            xmlNode   *node,
            LaminaJob *job)
{
  g_autoptr(LaminaJobEntry) e = lamina_job_entry_new (NULL, 0, NULL);

  e->line = lamina_xml_node_get_line (node);
  e->construction = lamina_xml_dup_attr (node, "construction");
  e->use = lamina_xml_dup_attr (node, "use");
  e->origin = lamina_xml_dup_attr (node, "origin");
  if (!get_count (s, node, "n", &e->n)
      || !get_count (s, node, "revision", &e->revision)
      || !get_count (s, node, "origin-revision", &e->origin_revision)
      || !get_number (s, node, "area", &e->area))
    return FALSE;
  for (xmlNode *child = node->children; child != NULL; child = child->next)
    if (lamina_xml_is_element (child, "location"))
      replace (&e->location, lamina_xml_dup_text (child));
  g_ptr_array_add (job->entries, g_steal_pointer (&e));
  return TRUE;
}

static gboolean
read_junction (Source    *s,
               xmlNode   *node,
               LaminaJob *job)
{
  g_autoptr(LaminaJobJunction) j = lamina_job_junction_new (NULL, NAN, NAN);

  j->line = lamina_xml_node_get_line (node);
  j->name = lamina_xml_dup_attr (node, "name");
  if (!get_count (s, node, "n", &j->n)
      || !get_number (s, node, "psi", &j->psi)
      || !get_number (s, node, "length", &j->length))
    return FALSE;
  g_ptr_array_add (job->junctions, g_steal_pointer (&j));
  return TRUE;
}

static gboolean
read_job_child (Source    *s,
                xmlNode   *child,
                LaminaJob *job)
{
  if (lamina_xml_is_element (child, "site"))
    replace (&job->site, lamina_xml_dup_text (child));
  else if (lamina_xml_is_element (child, "notes"))
    replace (&job->notes, lamina_xml_dup_text (child));
  else if (lamina_xml_is_element (child, "entry"))
    return read_entry (s, child, job);
  else if (lamina_xml_is_element (child, "junction"))
    return read_junction (s, child, job);
  else if (lamina_xml_is_element (child, "event"))
    {
      g_autofree char *at = lamina_xml_dup_attr (child, "at");
      g_autofree char *by = lamina_xml_dup_attr (child, "by");
      g_autofree char *text = lamina_xml_dup_attr (child, "text");

      lamina_job_log (job, at, by, text);
    }
  return TRUE;
}

static gboolean
read_job_attributes (Source    *s,
                     xmlNode   *node,
                     LaminaJob *job)
{
  g_autofree char *status = lamina_xml_dup_attr (node, "status");

  job->number = lamina_xml_dup_attr (node, "number");
  job->client = lamina_xml_dup_attr (node, "client");
  job->architect = lamina_xml_dup_attr (node, "architect");
  job->target_set = lamina_xml_dup_attr (node, "target-set");
  job->climate = lamina_xml_dup_attr (node, "climate");
  job->modified_at = lamina_xml_dup_attr (node, "modified-at");
  if (status != NULL && !lamina_job_status_from_string (status, &job->status))
    return fail (s, job->line, _("status=“%s” is not one of the allowed names"), status);
  return get_number (s, node, "inside-temperature", &job->inside_temperature)
         && get_number (s, node, "outside-temperature", &job->outside_temperature)
         && get_number (s, node, "ground-area", &job->ground_area)
         && get_number (s, node, "ground-perimeter", &job->ground_perimeter)
         && get_number (s, node, "ground-b-prime", &job->ground_b_prime);
}

gboolean
lamina_catalogue_read_job (LaminaCatalogue        *catalogue,
                           xmlNode                *node,
                           const LaminaXmlSource  *source)
{
  Source *s = source;
  g_autofree char *id = lamina_xml_dup_attr (node, "id");
  g_autofree char *job_name = lamina_xml_dup_attr (node, "name");
  g_autoptr(LaminaJob) job = lamina_job_new (id, job_name);
  LaminaJob *known = lamina_catalogue_find_job (catalogue, id);
  g_autoptr(GError) local = NULL;
  int line = 0;

  job->line = lamina_xml_node_get_line (node);
  if (known != NULL)
    return fail (s, job->line, _("job id “%s” is used twice (first on line %d)"), id, known->line);
  if (!read_job_attributes (s, node, job))
    return FALSE;
  for (xmlNode *child = node->children; child != NULL; child = child->next)
    if (!read_job_child (s, child, job))
      return FALSE;
  if (!lamina_job_validate (job, &line, &local))
    return fail (s, line > 0 ? line : job->line, "%s", local->message);
  g_ptr_array_add (catalogue->jobs, g_steal_pointer (&job));
  return TRUE;
}

/* Writing */

/* The writer refuses what the reader would refuse. */
static gboolean
refuse_invalid (GError  *local,
                GError **error)
{
  g_set_error_literal (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_INVALID, local->message);
  g_error_free (local);
  return FALSE;
}

static gboolean
write_target_set (const LaminaTargetSet *set,
                  GString               *out,
                  GError               **error)
{
  GError *local = NULL;

  if (!lamina_target_set_validate (set, NULL, &local))
    return refuse_invalid (local, error);
  if (!lamina_xml_check_text (set->id, _("name"), set->name, error)
      || !lamina_xml_check_text (set->id, _("source"), set->source, error)
      || !lamina_xml_check_text (set->id, _("notes"), set->notes, error))
    return FALSE;
  g_string_append (out, "  <target-set");
  lamina_xml_write_attr (out, "id", set->id);
  lamina_xml_write_attr (out, "name", set->name);
  lamina_xml_write_attr (out, "source", set->source);
  g_string_append (out, ">\n");
  lamina_xml_write_text_element (out, "    ", "notes", set->notes);
  for (guint i = 0; i < set->targets->len; i++)
    {
      const LaminaTarget *t = g_ptr_array_index (set->targets, i);

      if (!lamina_xml_check_text (set->id, _("label"), t->label, error))
        return FALSE;
      g_string_append (out, "    <target");
      lamina_xml_write_attr (out, "use", t->use);
      lamina_xml_write_number (out, "max-u", t->max_u);
      lamina_xml_write_attr (out, "label", t->label);
      if (t->element >= 0)
        lamina_xml_write_attr (out, "element", lamina_element_to_string ((LaminaElement) t->element));
      lamina_xml_write_number (out, "min-frsi", t->min_frsi);
      if (t->moisture != LAMINA_MOISTURE_NONE)
        lamina_xml_write_attr (out, "moisture", lamina_moisture_criterion_to_string (t->moisture));
      if (t->ground)
        lamina_xml_write_attr (out, "ground", "true");
      g_string_append (out, "/>\n");
    }
  g_string_append (out, "  </target-set>\n");
  return TRUE;
}

gboolean
lamina_catalogue_write_target_sets (const LaminaCatalogue *catalogue,
                                    GString               *out,
                                    GError               **error)
{
  for (guint i = 0; i < catalogue->target_sets->len; i++)
    if (!write_target_set (catalogue->target_sets->pdata[i], out, error))
      return FALSE;
  return TRUE;
}

static void
write_int (GString    *out,
           const char *name,
           int         value)
{
  if (value > 0)
    g_string_append_printf (out, " %s=\"%d\"", name, value);
}

static void
write_entry (const LaminaJobEntry *e,
             GString              *out)
{
  g_string_append (out, "    <entry");
  write_int (out, "n", e->n);
  lamina_xml_write_attr (out, "construction", e->construction);
  write_int (out, "revision", e->revision);
  lamina_xml_write_attr (out, "use", e->use);
  lamina_xml_write_number (out, "area", e->area);
  lamina_xml_write_attr (out, "origin", e->origin);
  write_int (out, "origin-revision", e->origin_revision);
  if (e->location == NULL)
    {
      g_string_append (out, "/>\n");
      return;
    }
  g_string_append (out, ">\n");
  lamina_xml_write_text_element (out, "      ", "location", e->location);
  g_string_append (out, "    </entry>\n");
}

static void
write_job_body (const LaminaJob *job,
                GString         *out)
{
  lamina_xml_write_text_element (out, "    ", "site", job->site);
  lamina_xml_write_text_element (out, "    ", "notes", job->notes);
  for (guint i = 0; i < job->entries->len; i++)
    write_entry (g_ptr_array_index (job->entries, i), out);
  for (guint i = 0; i < job->junctions->len; i++)
    {
      const LaminaJobJunction *j = g_ptr_array_index (job->junctions, i);

      g_string_append (out, "    <junction");
      write_int (out, "n", j->n);
      lamina_xml_write_attr (out, "name", j->name);
      lamina_xml_write_number (out, "psi", j->psi);
      lamina_xml_write_number (out, "length", j->length);
      g_string_append (out, "/>\n");
    }
  for (guint i = 0; i < job->log->len; i++)
    {
      const LaminaJobEvent *event = g_ptr_array_index (job->log, i);

      g_string_append (out, "    <event");
      lamina_xml_write_attr (out, "at", event->at);
      lamina_xml_write_attr (out, "by", event->by);
      lamina_xml_write_attr (out, "text", event->text);
      g_string_append (out, "/>\n");
    }
}

static gboolean
check_job_text (const LaminaJob *job,
                GError         **error)
{
  const char *const fields[] = { job->name, job->number, job->client, job->architect,
                                 job->site, job->notes, job->climate };
  const char *const names[] = { N_("name"), N_("number"), N_("client"), N_("architect"),
                                N_("site"), N_("notes"), N_("climate") };

  for (guint i = 0; i < G_N_ELEMENTS (fields); i++)
    if (!lamina_xml_check_text (job->id, _(names[i]), fields[i], error))
      return FALSE;
  for (guint i = 0; i < job->entries->len; i++)
    if (!lamina_xml_check_text (job->id, _("location"),
                                ((LaminaJobEntry *) g_ptr_array_index (job->entries, i))->location,
                                error))
      return FALSE;
  for (guint i = 0; i < job->log->len; i++)
    {
      const LaminaJobEvent *event = g_ptr_array_index (job->log, i);

      if (!lamina_xml_check_text (job->id, _("log"), event->text, error)
          || !lamina_xml_check_text (job->id, _("log"), event->by, error))
        return FALSE;
    }
  return TRUE;
}

static gboolean
write_job (const LaminaJob *job,
           GString         *out,
           GError         **error)
{
  GError *local = NULL;

  if (!lamina_job_validate (job, NULL, &local))
    return refuse_invalid (local, error);
  if (!check_job_text (job, error))
    return FALSE;
  g_string_append (out, "  <job");
  lamina_xml_write_attr (out, "id", job->id);
  lamina_xml_write_attr (out, "name", job->name);
  lamina_xml_write_attr (out, "number", job->number);
  lamina_xml_write_attr (out, "client", job->client);
  lamina_xml_write_attr (out, "architect", job->architect);
  lamina_xml_write_attr (out, "status", lamina_job_status_to_string (job->status));
  lamina_xml_write_attr (out, "target-set", job->target_set);
  lamina_xml_write_number (out, "inside-temperature", job->inside_temperature);
  lamina_xml_write_number (out, "outside-temperature", job->outside_temperature);
  lamina_xml_write_attr (out, "climate", job->climate);
  lamina_xml_write_number (out, "ground-area", job->ground_area);
  lamina_xml_write_number (out, "ground-perimeter", job->ground_perimeter);
  lamina_xml_write_number (out, "ground-b-prime", job->ground_b_prime);
  lamina_xml_write_attr (out, "modified-at", job->modified_at);
  g_string_append (out, ">\n");
  write_job_body (job, out);
  g_string_append (out, "  </job>\n");
  return TRUE;
}

gboolean
lamina_catalogue_write_jobs (const LaminaCatalogue *catalogue,
                             GString               *out,
                             GError               **error)
{
  for (guint i = 0; i < catalogue->jobs->len; i++)
    if (!write_job (catalogue->jobs->pdata[i], out, error))
      return FALSE;
  return TRUE;
}
