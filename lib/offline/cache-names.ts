/** Cache Storage name the service worker answers field navigations from; the page warms it too. */
export const FIELD_PAGES_CACHE = "turnstone-field-pages";
