// The district map's own marks, shared by the legend (server) and the map (browser).

/** A farm with no visit: a hollow ring in the slate of the page's text, unlike every verdict's vial. */
export const NO_VISIT_MARK =
  '<svg xmlns="http://www.w3.org/2000/svg" width="24" height="24" viewBox="0 0 24 24" aria-hidden="true"><circle cx="12" cy="12" r="8" fill="#fff" stroke="#2F3B40" stroke-width="3"/><circle cx="12" cy="12" r="2.5" fill="#2F3B40"/></svg>';
