/**
 * The Content-Security-Policy of the workbench page, shared by both shells: nothing from
 * outside the app's own origin, no inline or evaluated script, no plugins, no framing.
 * Inline styles are allowed because the chart library sets element styles at run time.
 * `blob:` is allowed for the report preview and for workers only.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "worker-src 'self' blob:",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "frame-src 'self' blob:",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');
