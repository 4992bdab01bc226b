/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-section-view.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "lamina-editor-state.h"
#include "lamina-text.h"
#include "sheet/lamina-section.h"

#define HIT_TOLERANCE 6.0
#define TEXT_UNIT     11.0

struct _LaminaSectionView
{
  GtkWidget                 parent_instance;

  /* borrowed */
  const LaminaConstruction *construction;
  const LaminaResult       *result;

  /* owned */
  LaminaSection            *painter;
  LaminaSectionLayout       layout;
  LaminaSectionStyle        style;
  int                       selected;
  int                       hover_edge;
  double                    snap_step;
  double                    zoom;
  gboolean                  show_temperatures;

  /* The drawing, kept between frames.  Drawn on an image surface of our
   * own, not on the snapshot's cairo node: the node records the drawing
   * and replays it, so the hatches would take their slow vector path on
   * every frame.  Redrawn only when what it shows changed. */
  cairo_surface_t          *frame;
  guint                     generation;      /* bumped by set_construction */
  guint                     frame_generation;
  int                       frame_scale;     /* the widget's scale factor */
  LaminaSectionStyle        frame_style;
  double                   *frame_edges;     /* the layout drawn */
  guint                     frame_n_edges;
  double                    frame_body[4];

  /* during a drag */
  int                       drag_edge;       /* −1 when not dragging */
  double                    drag_x0, drag_y0;   /* the boundary where it began */
  double                    drag_scale;
  double                    drag_anchor;     /* inner face on the axis */
  double                    drag_thickness;
};

G_DEFINE_FINAL_TYPE (LaminaSectionView, lamina_section_view, GTK_TYPE_WIDGET)

enum {
  PROP_0,
  PROP_SELECTED,
  PROP_SNAP_STEP,
  PROP_SHOW_TEMPERATURES,
  PROP_ZOOM,
  N_PROPS
};

enum {
  RESIZE,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

static double
get_scale (LaminaSectionView *self,
           double             width,
           double             height)
{
  if (self->drag_edge >= 0)
    return self->drag_scale;
  return lamina_section_fit_scale (self->construction, &self->style, width, height) * self->zoom;
}

static gboolean
is_body_inside (LaminaSectionView *self,
                double             width,
                double             height)
{
  const LaminaSectionLayout *l = &self->layout;
  double margin = self->style.unit;

  return l->body_x >= margin && l->body_y >= 0 && l->body_x + l->body_width <= width - margin
         && l->body_y + l->body_height <= height - margin;
}

/* Lays out the drawing for the widget's size.  While dragging, the scale
 * is frozen and the inner face pinned where it was, so the boundary stays
 * under the pointer instead of the centred drawing sliding away. */
static void
compute_layout (LaminaSectionView *self)
{
  double width = gtk_widget_get_width (GTK_WIDGET (self));
  double height = gtk_widget_get_height (GTK_WIDGET (self));

  self->style.scale = get_scale (self, width, height);
  lamina_section_layout_compute (&self->layout, self->construction, &self->style,
                                 0, 0, width, height);
  if (self->drag_edge >= 0)
    {
      double shift = self->drag_anchor - self->layout.edges[0];
      double x = self->layout.orientation == LAMINA_SECTION_ACROSS ? shift : 0;
      double y = self->layout.orientation == LAMINA_SECTION_ACROSS ? 0 : shift;

      lamina_section_layout_compute (&self->layout, self->construction, &self->style,
                                     x, y, width, height);
      /* A layer dragged thicker than the frame holds: fit the drawing
       * again and hold that scale and position from here on, so that the
       * section never runs out of its frame (zoomed in, it may). */
      if (self->zoom <= 1.0 && !is_body_inside (self, width, height))
        {
          double fit = lamina_section_fit_scale (self->construction, &self->style, width, height);

          self->style.scale = MIN (self->drag_scale, fit);
          lamina_section_layout_compute (&self->layout, self->construction, &self->style,
                                         0, 0, width, height);
          self->drag_scale = self->style.scale;
          self->drag_anchor = self->layout.edges[0];
        }
    }
}

static void
update_accessible (LaminaSectionView *self)
{
  g_autofree char *description = NULL;

  if (self->construction != NULL && self->selected >= 0 &&
      (guint) self->selected < self->construction->layers->len)
    {
      const LaminaLayer *layer = g_ptr_array_index (self->construction->layers, self->selected);
      g_autofree char *mm = lamina_text_mm (layer->thickness);

      /* Translators: layer number, its name and thickness */
      description = g_strdup_printf (_("Layer %d, %s, %s. Plus and minus change the thickness."),
                                     self->selected + 1, lamina_layer_get_label (layer), mm);
    }
  gtk_accessible_update_property (GTK_ACCESSIBLE (self),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Section of the construction"),
                                  GTK_ACCESSIBLE_PROPERTY_DESCRIPTION,
                                  description ? description : _("No layer selected"),
                                  -1);
}

static gboolean
is_frame_current (LaminaSectionView *self,
                  int                width,
                  int                height)
{
  double body[4] = { self->layout.body_x, self->layout.body_y, self->layout.body_width, self->layout.body_height };
  int scale = gtk_widget_get_scale_factor (GTK_WIDGET (self));

  return self->frame != NULL &&
         cairo_image_surface_get_width (self->frame) == width * scale &&
         cairo_image_surface_get_height (self->frame) == height * scale &&
         self->frame_scale == scale &&
         self->frame_generation == self->generation &&
         memcmp (&self->frame_style, &self->style, sizeof self->style) == 0 &&
         memcmp (self->frame_body, body, sizeof body) == 0 &&
         self->frame_n_edges == self->layout.n_layers + 1 &&
         memcmp (self->frame_edges, self->layout.edges, self->frame_n_edges * sizeof (double)) == 0;
}

static void
draw_frame (LaminaSectionView *self,
            int                width,
            int                height)
{
  int scale = gtk_widget_get_scale_factor (GTK_WIDGET (self));
  cairo_t *cr;

  if (self->frame == NULL ||
      cairo_image_surface_get_width (self->frame) != width * scale ||
      cairo_image_surface_get_height (self->frame) != height * scale)
    {
      g_clear_pointer (&self->frame, cairo_surface_destroy);
      self->frame = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, width * scale, height * scale);
      cairo_surface_set_device_scale (self->frame, scale, scale);
    }
  cr = cairo_create (self->frame);
  /* The widget's background shows through where the drawing leaves it. */
  cairo_set_operator (cr, CAIRO_OPERATOR_CLEAR);
  cairo_paint (cr);
  cairo_set_operator (cr, CAIRO_OPERATOR_OVER);
  lamina_section_draw (self->painter, cr, &self->layout, self->construction,
                       self->result, &self->style);
  cairo_destroy (cr);
  cairo_surface_flush (self->frame);

  self->frame_scale = scale;
  self->frame_generation = self->generation;
  self->frame_style = self->style;
  self->frame_body[0] = self->layout.body_x;
  self->frame_body[1] = self->layout.body_y;
  self->frame_body[2] = self->layout.body_width;
  self->frame_body[3] = self->layout.body_height;
  self->frame_n_edges = self->layout.n_layers + 1;
  self->frame_edges = g_renew (double, self->frame_edges, self->frame_n_edges);
  memcpy (self->frame_edges, self->layout.edges, self->frame_n_edges * sizeof (double));
}

static void
lamina_section_view_snapshot (GtkWidget   *widget,
                              GtkSnapshot *snapshot)
{
  LaminaSectionView *self = LAMINA_SECTION_VIEW (widget);
  int width = gtk_widget_get_width (widget);
  int height = gtk_widget_get_height (widget);
  cairo_t *cr;

  if (self->construction == NULL || self->construction->layers->len == 0 ||
      width < 8 || height < 8)
    return;

  compute_layout (self);
  self->style.highlight_layer = self->selected;
  self->style.highlight_boundary = self->drag_edge >= 0 ? self->drag_edge : self->hover_edge;
  self->style.temperatures = self->show_temperatures && self->result != NULL;

  if (!is_frame_current (self, width, height))
    draw_frame (self, width, height);
  cr = gtk_snapshot_append_cairo (snapshot, &GRAPHENE_RECT_INIT (0, 0, width, height));
  cairo_set_source_surface (cr, self->frame, 0, 0);
  cairo_paint (cr);
  cairo_destroy (cr);
}

static void
lamina_section_view_measure (GtkWidget      *widget,
                             GtkOrientation  orientation,
                             int             for_size,
                             int            *minimum,
                             int            *natural,
                             int            *minimum_baseline,
                             int            *natural_baseline)
{
  *minimum = orientation == GTK_ORIENTATION_HORIZONTAL ? 240 : 200;
  *natural = orientation == GTK_ORIENTATION_HORIZONTAL ? 520 : 320;
}

static void
set_selected_internal (LaminaSectionView *self,
                       int                layer)
{
  if (self->selected == layer)
    return;
  self->selected = layer;
  update_accessible (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SELECTED]);
}

static void
on_click_pressed_cb (LaminaSectionView *self,
                     int                n_press,
                     double             x,
                     double             y,
                     GtkGestureClick   *gesture)
{
  guint index = 0;

  gtk_widget_grab_focus (GTK_WIDGET (self));
  if (self->construction == NULL || self->layout.n_layers == 0)
    return;
  if (lamina_section_layout_hit (&self->layout, x, y, HIT_TOLERANCE, &index) == LAMINA_SECTION_HIT_LAYER)
    set_selected_internal (self, (int) index);
}

static void
on_motion_cb (LaminaSectionView        *self,
              double                    x,
              double                    y,
              GtkEventControllerMotion *controller)
{
  guint index = 0;
  int edge = -1;

  if (self->construction == NULL || self->layout.n_layers == 0)
    return;
  if (lamina_section_layout_hit (&self->layout, x, y, HIT_TOLERANCE, &index) == LAMINA_SECTION_HIT_BOUNDARY &&
      index > 0)
    edge = (int) index;
  if (edge != self->hover_edge)
    {
      self->hover_edge = edge;
      gtk_widget_set_cursor_from_name (GTK_WIDGET (self),
                                       edge < 0 ? NULL
                                       : self->layout.orientation == LAMINA_SECTION_ACROSS ? "col-resize"
                                       : "row-resize");
      gtk_widget_queue_draw (GTK_WIDGET (self));
    }
}

static gboolean
is_fine (GtkGesture *gesture)
{
  GdkModifierType state = gtk_event_controller_get_current_event_state (GTK_EVENT_CONTROLLER (gesture));

  /* A pointer drag has no keyboard layout to fight: Shift, or Alt as for
   * the keys. */
  return (state & (GDK_SHIFT_MASK | GDK_ALT_MASK)) != 0;
}

gboolean
lamina_section_view_resize_key (LaminaSectionView *self,
                                guint              keyval,
                                GdkModifierType    state)
{
  /* Many layouts need Shift to type "+": Shift must not make the step
   * fine, so the fine step is on Alt. */
  gboolean fine = (state & GDK_ALT_MASK) != 0;

  g_return_val_if_fail (LAMINA_IS_SECTION_VIEW (self), FALSE);

  if (self->construction == NULL || self->construction->layers->len == 0
      || (state & GDK_CONTROL_MASK) != 0)
    return FALSE;
  switch (keyval)
    {
    case GDK_KEY_plus:
    case GDK_KEY_KP_Add:
    case GDK_KEY_equal:
      lamina_section_view_nudge (self, 1, fine);
      return TRUE;
    case GDK_KEY_minus:
    case GDK_KEY_KP_Subtract:
    case GDK_KEY_underscore:
      lamina_section_view_nudge (self, -1, fine);
      return TRUE;
    default:
      return FALSE;
    }
}

static void
on_drag_begin_cb (LaminaSectionView *self,
                  double             x,
                  double             y,
                  GtkGestureDrag    *gesture)
{
  if (!lamina_section_view_drag_begin (self, x, y))
    gtk_gesture_set_state (GTK_GESTURE (gesture), GTK_EVENT_SEQUENCE_DENIED);
}

static void
on_drag_update_cb (LaminaSectionView *self,
                   double             dx,
                   double             dy,
                   GtkGestureDrag    *gesture)
{
  lamina_section_view_drag_update (self, dx, dy, is_fine (GTK_GESTURE (gesture)));
}

static void
on_drag_end_cb (LaminaSectionView *self,
                double             dx,
                double             dy,
                GtkGestureDrag    *gesture)
{
  lamina_section_view_drag_end (self, dx, dy, is_fine (GTK_GESTURE (gesture)));
}

static gboolean
on_key_pressed_cb (LaminaSectionView     *self,
                   guint                  keyval,
                   guint                  keycode,
                   GdkModifierType        state,
                   GtkEventControllerKey *controller)
{
  int n = self->construction ? (int) self->construction->layers->len : 0;
  gboolean forward = self->layout.orientation == LAMINA_SECTION_UPWARD
                     ? (keyval == GDK_KEY_Up || keyval == GDK_KEY_Right)
                     : (keyval == GDK_KEY_Down || keyval == GDK_KEY_Right);

  if (n == 0)
    return FALSE;
  switch (keyval)
    {
    case GDK_KEY_Left:
    case GDK_KEY_Right:
    case GDK_KEY_Up:
    case GDK_KEY_Down:
      set_selected_internal (self, CLAMP (self->selected + (forward ? 1 : -1), 0, n - 1));
      return TRUE;
    default:
      return lamina_section_view_resize_key (self, keyval, state);
    }
}

static void
lamina_section_view_finalize (GObject *object)
{
  LaminaSectionView *self = LAMINA_SECTION_VIEW (object);

  g_clear_pointer (&self->painter, lamina_section_free);
  g_clear_pointer (&self->frame, cairo_surface_destroy);
  g_clear_pointer (&self->frame_edges, g_free);
  lamina_section_layout_clear (&self->layout);

  G_OBJECT_CLASS (lamina_section_view_parent_class)->finalize (object);
}

static void
lamina_section_view_get_property (GObject    *object,
                                  guint       prop_id,
                                  GValue     *value,
                                  GParamSpec *pspec)
{
  LaminaSectionView *self = LAMINA_SECTION_VIEW (object);

  switch (prop_id)
    {
    case PROP_SELECTED:
      g_value_set_int (value, self->selected);
      break;
    case PROP_SNAP_STEP:
      g_value_set_double (value, self->snap_step);
      break;
    case PROP_SHOW_TEMPERATURES:
      g_value_set_boolean (value, self->show_temperatures);
      break;
    case PROP_ZOOM:
      g_value_set_double (value, self->zoom);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
lamina_section_view_set_property (GObject      *object,
                                  guint         prop_id,
                                  const GValue *value,
                                  GParamSpec   *pspec)
{
  LaminaSectionView *self = LAMINA_SECTION_VIEW (object);

  switch (prop_id)
    {
    case PROP_SELECTED:
      lamina_section_view_set_selected (self, g_value_get_int (value));
      break;
    case PROP_SNAP_STEP:
      lamina_section_view_set_snap_step (self, g_value_get_double (value));
      break;
    case PROP_SHOW_TEMPERATURES:
      lamina_section_view_set_show_temperatures (self, g_value_get_boolean (value));
      break;
    case PROP_ZOOM:
      lamina_section_view_set_zoom (self, g_value_get_double (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
lamina_section_view_class_init (LaminaSectionViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->finalize = lamina_section_view_finalize;
  object_class->get_property = lamina_section_view_get_property;
  object_class->set_property = lamina_section_view_set_property;
  widget_class->snapshot = lamina_section_view_snapshot;
  widget_class->measure = lamina_section_view_measure;

  properties[PROP_SELECTED] =
    g_param_spec_int ("selected", NULL, NULL, -1, G_MAXINT, -1,
                      G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS | G_PARAM_EXPLICIT_NOTIFY);
  properties[PROP_SNAP_STEP] =
    g_param_spec_double ("snap-step", NULL, NULL, 0.0, 1000.0, 5.0,
                         G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS | G_PARAM_EXPLICIT_NOTIFY);
  properties[PROP_SHOW_TEMPERATURES] =
    g_param_spec_boolean ("show-temperatures", NULL, NULL, FALSE,
                          G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS | G_PARAM_EXPLICIT_NOTIFY);
  properties[PROP_ZOOM] =
    g_param_spec_double ("zoom", NULL, NULL, 0.1, 20.0, 1.0,
                         G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS | G_PARAM_EXPLICIT_NOTIFY);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  /* (layer index, thickness in mm, live): live while the pointer moves,
   * not live when the drag or key press is done. */
  signals[RESIZE] = g_signal_new ("resize", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                  0, NULL, NULL, NULL, G_TYPE_NONE, 3,
                                  G_TYPE_UINT, G_TYPE_DOUBLE, G_TYPE_BOOLEAN);

  gtk_widget_class_set_css_name (widget_class, "lamina-section-view");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_IMG);
}

static void
lamina_section_view_init (LaminaSectionView *self)
{
  GtkGesture *click;
  GtkGesture *drag;
  GtkEventController *motion;
  GtkEventController *key;

  self->painter = lamina_section_new ();
  lamina_section_layout_init (&self->layout);
  lamina_section_style_init (&self->style, TEXT_UNIT);
  self->selected = -1;
  self->hover_edge = -1;
  self->drag_edge = -1;
  self->snap_step = 5.0;
  self->zoom = 1.0;

  gtk_widget_set_focusable (GTK_WIDGET (self), TRUE);
  gtk_widget_set_hexpand (GTK_WIDGET (self), TRUE);
  gtk_widget_set_vexpand (GTK_WIDGET (self), TRUE);

  click = gtk_gesture_click_new ();
  g_signal_connect_object (click, "pressed", G_CALLBACK (on_click_pressed_cb), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (click));

  drag = gtk_gesture_drag_new ();
  g_signal_connect_object (drag, "drag-begin", G_CALLBACK (on_drag_begin_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (drag, "drag-update", G_CALLBACK (on_drag_update_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (drag, "drag-end", G_CALLBACK (on_drag_end_cb), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (drag));

  motion = gtk_event_controller_motion_new ();
  g_signal_connect_object (motion, "motion", G_CALLBACK (on_motion_cb), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self), motion);

  key = gtk_event_controller_key_new ();
  g_signal_connect_object (key, "key-pressed", G_CALLBACK (on_key_pressed_cb), self, G_CONNECT_SWAPPED);
  gtk_widget_add_controller (GTK_WIDGET (self), key);

  update_accessible (self);
}

GtkWidget *
lamina_section_view_new (void)
{
  return g_object_new (LAMINA_TYPE_SECTION_VIEW, NULL);
}

void
lamina_section_view_set_construction (LaminaSectionView        *self,
                                      const LaminaConstruction *construction,
                                      const LaminaResult       *result)
{
  g_return_if_fail (LAMINA_IS_SECTION_VIEW (self));

  self->construction = construction;
  self->result = result;
  /* The same construction may come back edited in place. */
  self->generation++;
  if (construction == NULL || self->selected >= (int) construction->layers->len)
    set_selected_internal (self, construction && construction->layers->len ? (int) construction->layers->len - 1 : -1);
  update_accessible (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

int
lamina_section_view_get_selected (LaminaSectionView *self)
{
  g_return_val_if_fail (LAMINA_IS_SECTION_VIEW (self), -1);
  return self->selected;
}

void
lamina_section_view_set_selected (LaminaSectionView *self,
                                  int                layer)
{
  g_return_if_fail (LAMINA_IS_SECTION_VIEW (self));
  set_selected_internal (self, layer);
}

void
lamina_section_view_set_snap_step (LaminaSectionView *self,
                                   double             step)
{
  g_return_if_fail (LAMINA_IS_SECTION_VIEW (self));
  if (self->snap_step == step)
    return;
  self->snap_step = step;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SNAP_STEP]);
}

gboolean
lamina_section_view_get_show_temperatures (LaminaSectionView *self)
{
  g_return_val_if_fail (LAMINA_IS_SECTION_VIEW (self), FALSE);
  return self->show_temperatures;
}

void
lamina_section_view_set_show_temperatures (LaminaSectionView *self,
                                           gboolean           show)
{
  g_return_if_fail (LAMINA_IS_SECTION_VIEW (self));
  show = !!show;
  if (self->show_temperatures == show)
    return;
  self->show_temperatures = show;
  gtk_widget_queue_draw (GTK_WIDGET (self));
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SHOW_TEMPERATURES]);
}

double
lamina_section_view_get_zoom (LaminaSectionView *self)
{
  g_return_val_if_fail (LAMINA_IS_SECTION_VIEW (self), 1.0);
  return self->zoom;
}

void
lamina_section_view_set_zoom (LaminaSectionView *self,
                              double             zoom)
{
  g_return_if_fail (LAMINA_IS_SECTION_VIEW (self));
  zoom = CLAMP (zoom, 0.1, 20.0);
  if (self->zoom == zoom)
    return;
  self->zoom = zoom;
  gtk_widget_queue_draw (GTK_WIDGET (self));
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_ZOOM]);
}

gboolean
lamina_section_view_drag_begin (LaminaSectionView *self,
                                double             x,
                                double             y)
{
  const LaminaLayer *layer;
  guint index = 0;

  g_return_val_if_fail (LAMINA_IS_SECTION_VIEW (self), FALSE);

  if (self->construction == NULL || self->layout.n_layers == 0 ||
      self->layout.n_layers != self->construction->layers->len)
    return FALSE;
  if (lamina_section_layout_hit (&self->layout, x, y, HIT_TOLERANCE, &index) != LAMINA_SECTION_HIT_BOUNDARY ||
      index == 0)
    return FALSE;

  layer = g_ptr_array_index (self->construction->layers, index - 1);
  /* From the boundary itself, not the pointer a few pixels off it, so
   * that the layer keeps its thickness until the pointer moves. */
  lamina_section_view_get_boundary_point (self, index, &self->drag_x0, &self->drag_y0);
  self->drag_edge = (int) index;
  self->drag_thickness = layer->thickness;
  self->drag_scale = self->layout.scale;
  self->drag_anchor = self->layout.edges[0];
  set_selected_internal (self, (int) index - 1);
  return TRUE;
}

static double
get_step (LaminaSectionView *self,
          gboolean           fine)
{
  return fine ? self->snap_step / 10.0 : self->snap_step;
}

void
lamina_section_view_drag_update (LaminaSectionView *self,
                                 double             dx,
                                 double             dy,
                                 gboolean           fine)
{
  double thickness;

  g_return_if_fail (LAMINA_IS_SECTION_VIEW (self));

  if (self->drag_edge < 0)
    return;
  /* The layout is frozen in scale with its inner face pinned while
   * dragging (compute_layout), so its own geometry turns the pointer
   * into a thickness whatever the drawing's orientation. */
  thickness = lamina_section_layout_drag_thickness (&self->layout, (guint) self->drag_edge,
                                                    self->drag_x0 + dx, self->drag_y0 + dy, 0.0);
  thickness = lamina_edit_snap (thickness, get_step (self, fine));
  if (thickness == self->drag_thickness)
    return;
  self->drag_thickness = thickness;
  g_signal_emit (self, signals[RESIZE], 0, (guint) self->drag_edge - 1, thickness, TRUE);
}

void
lamina_section_view_drag_end (LaminaSectionView *self,
                              double             dx,
                              double             dy,
                              gboolean           fine)
{
  guint layer;

  g_return_if_fail (LAMINA_IS_SECTION_VIEW (self));

  if (self->drag_edge < 0)
    return;
  lamina_section_view_drag_update (self, dx, dy, fine);
  layer = (guint) self->drag_edge - 1;
  self->drag_edge = -1;
  g_signal_emit (self, signals[RESIZE], 0, layer, self->drag_thickness, FALSE);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

gboolean
lamina_section_view_get_boundary_point (LaminaSectionView *self,
                                        guint              edge,
                                        double            *x,
                                        double            *y)
{
  g_return_val_if_fail (LAMINA_IS_SECTION_VIEW (self), FALSE);

  if (self->construction == NULL || self->layout.n_layers != self->construction->layers->len ||
      edge > self->layout.n_layers)
    return FALSE;
  if (self->layout.orientation == LAMINA_SECTION_ACROSS)
    {
      *x = self->layout.edges[edge];
      *y = self->layout.body_y + self->layout.body_height / 2;
    }
  else
    {
      *x = self->layout.body_x + self->layout.body_width / 2;
      *y = self->layout.edges[edge];
    }
  return TRUE;
}

void
lamina_section_view_nudge (LaminaSectionView *self,
                           int                steps,
                           gboolean           fine)
{
  const LaminaLayer *layer;
  double step;
  double thickness;

  g_return_if_fail (LAMINA_IS_SECTION_VIEW (self));

  if (self->construction == NULL || self->selected < 0 ||
      (guint) self->selected >= self->construction->layers->len)
    return;
  layer = g_ptr_array_index (self->construction->layers, self->selected);
  step = get_step (self, fine);
  thickness = lamina_edit_snap (layer->thickness + steps * step, step);
  if (thickness != layer->thickness)
    g_signal_emit (self, signals[RESIZE], 0, (guint) self->selected, thickness, FALSE);
}
