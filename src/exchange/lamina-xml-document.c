/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Safe parsing of untrusted catalogue XML with libxml2 2.9.
 *
 * The traps (see the platform notes): XML_PARSE_NOENT reads local files
 * through external entities, XML_PARSE_NONET does not block file://, and
 * entity references left in the tree can still expand quadratically later.
 * So: no NOENT, no HUGE, no DTD loading, and any DOCTYPE stops the parser
 * at once (before its internal subset is read) and refuses the document.
 * libxml2 errors are captured per parse through structured handlers and
 * never printed; the first one becomes the GError, "NAME:LINE: message". */
#define G_LOG_DOMAIN "lamina-exchange"

#include "lamina-catalogue-private.h"

#include <errno.h>
#include <gio/gio.h>
#include <glib/gi18n-lib.h>
#include <libxml/parser.h>
#include <libxml/parserInternals.h>
#include <libxml/SAX2.h>
#include <libxml/xmlschemas.h>
#include <math.h>
#include <string.h>

#include "lamina-exchange-resources.h"

/* The "number" type of data/lamina-catalogue-1.xsd. */
#define NUMBER_PATTERN "[+\\-]?([0-9]+(\\.[0-9]*)?|\\.[0-9]+)([eE][+\\-]?[0-9]+)?"
#define SCHEMA_RESOURCE "/org/example/Lamina/exchange/lamina-catalogue-1.xsd"

typedef struct
{
  char     *message;   /* the first error, or NULL */
  int       line;
  gboolean  doctype;
  int       doctype_line;
} ErrorSink;

/* libxml2 suggests its own options ("Excessive depth in document: 256
 * use XML_PARSE_HUGE option"): a user of Lamina cannot set them and must
 * not, so say what is wrong in the document's terms instead. */
static void
strip_parser_options (GString *message)
{
  char *option = strstr (message->str, "XML_PARSE_");
  char *cut;

  if (strstr (message->str, "Excessive depth in document") != NULL)
    {
      g_string_assign (message, _("the elements are nested too deeply (more than 256 levels)"));
      return;
    }
  if (option == NULL)
    return;
  /* Cut the advice from the word that introduces it ("use", "try"). */
  cut = option;
  while (cut > message->str && cut[-1] == ' ')
    cut--;
  while (cut > message->str && cut[-1] != ' ' && cut[-1] != ',' && cut[-1] != ':' && cut[-1] != ';')
    cut--;
  while (cut > message->str && (cut[-1] == ' ' || cut[-1] == ',' || cut[-1] == ';'))
    cut--;
  g_string_truncate (message, cut - message->str);
}

static void
record_error (ErrorSink         *sink,
              const xmlError    *err)
{
  g_autofree char *text = NULL;
  GString *message;
  char *ns;

  if (sink->message != NULL || err == NULL || err->level < XML_ERR_ERROR)
    return;
  text = g_strstrip (g_strdup (err->message ? err->message : "error"));
  /* Schema messages spell names as {namespace}name: drop our namespace. */
  message = g_string_new (text);
  while ((ns = strstr (message->str, "{" LAMINA_CATALOGUE_NAMESPACE "}")) != NULL)
    g_string_erase (message, ns - message->str, strlen ("{" LAMINA_CATALOGUE_NAMESPACE "}"));
  /* The pattern of a number says nothing to a reader: say it in words. */
  g_string_replace (message, "[facet 'pattern'] ", "", 0);
  g_string_replace (message, "is not accepted by the pattern '" NUMBER_PATTERN "'",
                    _("is not a plain decimal number such as 12.5 (no units, blanks, NaN or INF)"), 0);
  g_string_replace (message, "\n", " ", 0);
  strip_parser_options (message);
  sink->message = g_string_free (message, FALSE);
  sink->line = err->node != NULL ? lamina_xml_node_get_line (err->node) : err->line;
}

static void
parser_error_cb (void     *ctx,
                 xmlError *err)
{
  xmlParserCtxt *ctxt = ctx;

  record_error (ctxt->_private, err);
}

static void
sink_error_cb (void     *data,
               xmlError *err)
{
  record_error (data, err);
}

static void
ignore_generic_error_cb (void       *ctx,
                         const char *msg,
                         ...)
{
}

/* libxml2's global handlers are per thread; while a document is read they
 * catch the few errors that do not go through a context (encoding
 * conversion, memory) into @sink, and nothing is printed. */
typedef struct
{
  xmlStructuredErrorFunc structured;
  void                  *structured_context;
  xmlGenericErrorFunc    generic;
  void                  *generic_context;
} ErrorHandlers;

static void
catch_errors (ErrorHandlers *saved,
              ErrorSink     *sink)
{
  saved->structured = xmlStructuredError;
  saved->structured_context = xmlStructuredErrorContext;
  saved->generic = xmlGenericError;
  saved->generic_context = xmlGenericErrorContext;
  xmlSetStructuredErrorFunc (sink, sink_error_cb);
  xmlSetGenericErrorFunc (NULL, ignore_generic_error_cb);
}

static void
release_errors (const ErrorHandlers *saved)
{
  xmlSetStructuredErrorFunc (saved->structured_context, saved->structured);
  xmlSetGenericErrorFunc (saved->generic_context, saved->generic);
}

/* Called at "<!DOCTYPE name": refuse before any declaration is read. */
static void
refuse_doctype_cb (void          *ctx,
                   const xmlChar *name,
                   const xmlChar *external_id,
                   const xmlChar *system_id)
{
  xmlParserCtxt *ctxt = ctx;
  ErrorSink *sink = ctxt->_private;

  sink->doctype = TRUE;
  sink->doctype_line = ctxt->input ? ctxt->input->line : 0;
  xmlStopParser (ctxt);
}

static xmlParserInput *
refuse_entity_cb (void          *ctx,
                  const xmlChar *public_id,
                  const xmlChar *system_id)
{
  return NULL;
}

static void
ignore_external_subset_cb (void          *ctx,
                           const xmlChar *name,
                           const xmlChar *external_id,
                           const xmlChar *system_id)
{
}

/* libxml2 2.9 keeps 16-bit element lines; past 65535 xmlGetLineNo guesses
 * from a neighbouring node and is off by one.  Keep the true line of each
 * element in its _private field. */
static void
start_element_cb (void           *ctx,
                  const xmlChar  *localname,
                  const xmlChar  *prefix,
                  const xmlChar  *uri,
                  int             nb_namespaces,
                  const xmlChar **namespaces,
                  int             nb_attributes,
                  int             nb_defaulted,
                  const xmlChar **attributes)
{
  xmlParserCtxt *ctxt = ctx;

  xmlSAX2StartElementNs (ctx, localname, prefix, uri, nb_namespaces, namespaces,
                         nb_attributes, nb_defaulted, attributes);
  if (ctxt->node != NULL && ctxt->input != NULL)
    ctxt->node->_private = GINT_TO_POINTER (ctxt->input->line);
}

int
lamina_xml_node_get_line (xmlNode *node)
{
  if (node->type == XML_ATTRIBUTE_NODE && node->parent != NULL)
    node = node->parent;
  if (node->type == XML_ELEMENT_NODE && node->_private != NULL)
    return GPOINTER_TO_INT (node->_private);
  return (int) xmlGetLineNo (node);
}

static gboolean
fail (GError     **error,
      int          code,
      const char  *name,
      int          line,
      const char  *message)
{
  g_set_error (error, LAMINA_XML_ERROR, code, "%s:%d: %s", name, MAX (line, 1), message);
  return FALSE;
}

/* The schema is compiled once, from the copy built into the program. */
static xmlSchema *
get_schema (GError **error)
{
  static GMutex lock;
  static xmlSchema *schema;
  static char *failure;
  xmlSchema *result;

  g_mutex_lock (&lock);
  if (schema == NULL && failure == NULL)
    {
      g_autoptr(GBytes) bytes = NULL;
      g_autoptr(GError) local = NULL;
      ErrorSink sink = { 0 };

      bytes = g_resource_lookup_data (lamina_exchange_get_resource (), SCHEMA_RESOURCE,
                                      G_RESOURCE_LOOKUP_FLAGS_NONE, &local);
      if (bytes == NULL)
        failure = g_strdup (local->message);
      else
        {
          xmlSchemaParserCtxt *pctxt;
          gsize size;
          const char *xsd = g_bytes_get_data (bytes, &size);

          pctxt = xmlSchemaNewMemParserCtxt (xsd, (int) size);
          xmlSchemaSetParserStructuredErrors (pctxt, sink_error_cb, &sink);
          schema = xmlSchemaParse (pctxt);
          xmlSchemaFreeParserCtxt (pctxt);
          if (schema == NULL)
            failure = g_strdup_printf ("lamina-catalogue-1.xsd:%d: %s", sink.line,
                                       sink.message ? sink.message : "cannot compile");
          g_free (sink.message);
        }
    }
  result = schema;
  if (result == NULL)
    g_set_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_IO,
                 _("The catalogue schema built into Lamina is broken: %s"), failure);
  g_mutex_unlock (&lock);
  return result;
}

static xmlDoc *
parse_safely (const char *data,
              gsize       length,
              ErrorSink  *sink)
{
  xmlParserCtxt *ctxt;
  xmlDoc *doc;

  ctxt = xmlNewParserCtxt ();
  if (ctxt == NULL)
    return NULL;
  ctxt->_private = sink;
  ctxt->sax->serror = parser_error_cb;
  ctxt->sax->startElementNs = start_element_cb;
  ctxt->sax->internalSubset = refuse_doctype_cb;
  ctxt->sax->externalSubset = ignore_external_subset_cb;
  ctxt->sax->resolveEntity = refuse_entity_cb;
  doc = xmlCtxtReadMemory (ctxt, data, (int) length, NULL, NULL,
                           XML_PARSE_NONET | XML_PARSE_NOWARNING | XML_PARSE_BIG_LINES);
  xmlFreeParserCtxt (ctxt);
  return doc;
}

static gboolean
check_root (xmlDoc      *doc,
            const char  *name,
            GError     **error)
{
  xmlNode *root = xmlDocGetRootElement (doc);
  int line = root ? lamina_xml_node_get_line (root) : 1;
  g_autofree char *message = NULL;
  xmlChar *format;
  gboolean ok = TRUE;

  if (root == NULL)
    return fail (error, LAMINA_XML_ERROR_MALFORMED, name, 1, _("the document has no root element"));
  if (root->ns == NULL || strcmp ((const char *) root->ns->href, LAMINA_CATALOGUE_NAMESPACE) != 0
      || strcmp ((const char *) root->name, "catalogue") != 0)
    {
      message = g_strdup_printf (_("not a Lamina catalogue: the root element is <%s> in namespace “%s”, "
                                   "expected <catalogue> in namespace “%s”"),
                                 (const char *) root->name,
                                 root->ns ? (const char *) root->ns->href : "",
                                 LAMINA_CATALOGUE_NAMESPACE);
      return fail (error, LAMINA_XML_ERROR_MALFORMED, name, line, message);
    }
  format = xmlGetNoNsProp (root, (const xmlChar *) "format");
  if (format != NULL && strcmp ((const char *) format, "1") != 0)
    {
      message = g_strdup_printf (_("catalogue format “%s” is not supported: this version of Lamina "
                                   "reads format %d"), (const char *) format, LAMINA_CATALOGUE_FORMAT);
      ok = fail (error, LAMINA_XML_ERROR_MALFORMED, name, line, message);
    }
  xmlFree (format);
  return ok;
}

static gboolean
validate (xmlDoc      *doc,
          const char  *name,
          ErrorSink   *sink,
          GError     **error)
{
  xmlSchema *schema = get_schema (error);
  xmlSchemaValidCtxt *vctxt;
  int rc;

  if (schema == NULL)
    return FALSE;
  vctxt = xmlSchemaNewValidCtxt (schema);
  xmlSchemaSetValidStructuredErrors (vctxt, sink_error_cb, sink);
  rc = xmlSchemaValidateDoc (vctxt, doc);
  xmlSchemaFreeValidCtxt (vctxt);
  if (rc == 0)
    return TRUE;
  return fail (error, LAMINA_XML_ERROR_SCHEMA, name, sink->line,
               sink->message ? sink->message : _("the document breaks the catalogue schema"));
}

xmlDoc *
lamina_xml_document_parse (const char  *data,
                           gsize        length,
                           const char  *name,
                           GError     **error)
{
  g_autoptr(xmlDoc) doc = NULL;
  ErrorSink sink = { 0 };
  ErrorHandlers handlers;
  gboolean ok = FALSE;

  g_return_val_if_fail (data != NULL || length == 0, NULL);

  if (name == NULL)
    name = "<memory>";
  if (length == 0)
    {
      fail (error, LAMINA_XML_ERROR_MALFORMED, name, 1, _("the document is empty"));
      return NULL;
    }
  if (length > LAMINA_CATALOGUE_MAX_SIZE)
    {
      fail (error, LAMINA_XML_ERROR_MALFORMED, name, 1, _("the document is larger than 256 MiB"));
      return NULL;
    }

  xmlInitParser ();
  catch_errors (&handlers, &sink);

  doc = parse_safely (data, length, &sink);
  if (sink.doctype || (doc != NULL && (doc->intSubset != NULL || doc->extSubset != NULL)))
    fail (error, LAMINA_XML_ERROR_MALFORMED, name, sink.doctype ? sink.doctype_line : 1,
          _("a document type declaration (DOCTYPE) is not allowed in a catalogue: "
            "it can declare entities that read files or expand without limit"));
  else if (doc == NULL)
    fail (error, LAMINA_XML_ERROR_MALFORMED, name, sink.line,
          sink.message ? sink.message : _("the document is not well-formed XML"));
  else if (check_root (doc, name, error))
    ok = validate (doc, name, &sink, error);

  release_errors (&handlers);
  g_free (sink.message);
  return ok ? g_steal_pointer (&doc) : NULL;
}

/* The writer's guard: the schema checked while parsing, without building a
 * tree (a tree of a 10,000-construction document and its freeing were a
 * third of an export).  For documents Lamina wrote itself, so no DOCTYPE
 * or root check is needed; errors read "NAME:LINE: message". */
gboolean
lamina_xml_document_check (const char  *data,
                           gsize        length,
                           const char  *name,
                           GError     **error)
{
  xmlSchema *schema = get_schema (error);
  xmlSAXHandler sax = { 0 };
  ErrorSink sink = { 0 };
  xmlParserInputBuffer *input;
  xmlSchemaValidCtxt *vctxt;
  ErrorHandlers handlers;
  int rc;

  if (schema == NULL)
    return FALSE;
  if (length > LAMINA_CATALOGUE_MAX_SIZE)
    return fail (error, LAMINA_XML_ERROR_MALFORMED, name, 1, _("the document is larger than 256 MiB"));
  input = xmlParserInputBufferCreateMem (data, (int) length, XML_CHAR_ENCODING_NONE);
  if (input == NULL)
    return fail (error, LAMINA_XML_ERROR_IO, name, 1, _("out of memory"));

  catch_errors (&handlers, &sink);

  /* No callbacks of our own: the schema's SAX plug sees every event and
   * nothing is built. */
  sax.initialized = XML_SAX2_MAGIC;
  vctxt = xmlSchemaNewValidCtxt (schema);
  xmlSchemaSetValidStructuredErrors (vctxt, sink_error_cb, &sink);
  /* The input buffer belongs to the parser from here on. */
  rc = xmlSchemaValidateStream (vctxt, input, XML_CHAR_ENCODING_NONE, &sax, NULL);
  xmlSchemaFreeValidCtxt (vctxt);

  release_errors (&handlers);
  if (rc != 0)
    fail (error, LAMINA_XML_ERROR_SCHEMA, name, sink.line,
          sink.message ? sink.message : _("the document breaks the catalogue schema"));
  g_free (sink.message);
  return rc == 0;
}

/* Reading values */

gboolean
lamina_xml_is_element (xmlNode    *node,
                       const char *name)
{
  return node->type == XML_ELEMENT_NODE
         && node->ns != NULL
         && strcmp ((const char *) node->ns->href, LAMINA_CATALOGUE_NAMESPACE) == 0
         && strcmp ((const char *) node->name, name) == 0;
}

char *
lamina_xml_dup_attr (xmlNode    *node,
                     const char *name)
{
  xmlChar *value = xmlGetNoNsProp (node, (const xmlChar *) name);
  char *copy = g_strdup ((const char *) value);

  xmlFree (value);
  return copy;
}

char *
lamina_xml_dup_text (xmlNode *node)
{
  xmlChar *value = xmlNodeGetContent (node);
  char *copy = g_strdup (value ? (const char *) value : "");

  xmlFree (value);
  return copy;
}

gboolean
lamina_xml_parse_number (const char  *attr,
                         const char  *text,
                         double      *value,
                         char       **message)
{
  char *end = NULL;
  double v;

  if (text[0] == '\0' || g_ascii_isspace (text[0]) || strpbrk (text, "xXnN") != NULL)
    {
      *message = g_strdup_printf (_("%s=“%s” is not a number"), attr, text);
      return FALSE;
    }
  errno = 0;
  v = g_ascii_strtod (text, &end);
  if (end == text || *end != '\0')
    {
      *message = g_strdup_printf (_("%s=“%s” is not a number"), attr, text);
      return FALSE;
    }
  if (!isfinite (v) || errno == ERANGE)
    {
      *message = g_strdup_printf (_("%s=“%s” is out of range (not a finite number of usual size)"),
                                  attr, text);
      return FALSE;
    }
  *value = v;
  return TRUE;
}

gboolean
lamina_xml_fail (const LaminaXmlSource *s,
                 int                    line,
                 int                    code,
                 const char            *format,
                 ...)
{
  g_autofree char *message = NULL;
  va_list args;

  va_start (args, format);
  message = g_strdup_vprintf (format, args);
  va_end (args);
  g_set_error (s->error, LAMINA_XML_ERROR, code, "%s:%d: %s", s->name, MAX (line, 1), message);
  return FALSE;
}

gboolean
lamina_xml_get_number (const LaminaXmlSource *s,
                       xmlNode               *node,
                       const char            *attr,
                       double                *value)
{
  g_autofree char *text = lamina_xml_dup_attr (node, attr);
  g_autofree char *message = NULL;

  if (text == NULL)
    return TRUE;
  if (!lamina_xml_parse_number (attr, text, value, &message))
    return lamina_xml_fail (s, lamina_xml_node_get_line (node), LAMINA_XML_ERROR_INVALID,
                            "%s", message);
  return TRUE;
}

/* The schema has checked the digits; this checks the range. */
gboolean
lamina_xml_get_count (const LaminaXmlSource *s,
                      xmlNode               *node,
                      const char            *attr,
                      guint64                min,
                      guint64                max,
                      int                   *value)
{
  g_autofree char *text = lamina_xml_dup_attr (node, attr);
  guint64 v;

  g_return_val_if_fail (max <= G_MAXINT, FALSE);
  if (text == NULL)
    return TRUE;
  if (!g_ascii_string_to_unsigned (text, 10, min, max, &v, NULL))
    {
      int line = lamina_xml_node_get_line (node);

      /* Numbers of entries and revisions have no upper limit to tell. */
      if (min == 1 && max == G_MAXINT)
        return lamina_xml_fail (s, line, LAMINA_XML_ERROR_INVALID,
                                _("%s=“%s” is not a whole number from 1"), attr, text);
      g_return_val_if_fail (min == 0, FALSE);
      return lamina_xml_fail (s, line, LAMINA_XML_ERROR_INVALID,
                              _("%s=“%s” is not a whole number from 0 to %llu"), attr, text,
                              (unsigned long long) max);
    }
  *value = (int) v;
  return TRUE;
}
