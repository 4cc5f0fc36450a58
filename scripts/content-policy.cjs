/**
 * The task pane's Content-Security-Policy, for each way the page gets office.js. The page itself
 * needs only its own origin: its scripts, its stylesheet, inline SVG images (data:), no
 * connections, no forms. What office.js adds depends on where it comes from:
 *
 * - local copy (`office-js/`, tests, development, offline use): nothing beyond 'self';
 * - the CDN (store build): its origin for scripts, because office.js loads its host- and
 *   locale-specific files from beside itself (the hosted path of the CDN); the same origin for
 *   frames, because the web host's script opens its hidden check page from there; and the
 *   Microsoft Ajax library, which office.js loads from ajax.aspnetcdn.com on some hosts. These are
 *   the origins reported in the OfficeDev/office-js tracker (issue #1005, "Document required CSP
 *   values", and the matching office-js-docs-pr issue #721), read here against the office.js
 *   source (the script and frame URLs it builds).
 *
 * office.js's telemetry (browser.pipe.aria.microsoft.com) is deliberately not allowed: it is not
 * needed for the add-in to work, and nothing leaves the page (connect-src 'none').
 */
const OFFICE_JS_CDN = "https://appsforoffice.microsoft.com/lib/1/hosted/office.js";
const OFFICE_JS_LOCAL = "office-js/office.js";
const CDN_ORIGIN = new URL(OFFICE_JS_CDN).origin;
const AJAX_ORIGIN = "https://ajax.aspnetcdn.com";

/** @param {"cdn" | "local"} officeJs */
function contentPolicy(officeJs) {
  const cdn = officeJs === "cdn";
  const directives = [
    ["default-src", "'none'"],
    ["script-src", cdn ? `'self' ${CDN_ORIGIN} ${AJAX_ORIGIN}` : "'self'"],
    ["style-src", "'self'"],
    ["img-src", "'self' data:"],
    ["font-src", "'self'"],
    ["connect-src", "'none'"],
    ["frame-src", cdn ? `'self' ${CDN_ORIGIN}` : "'self'"],
    ["base-uri", "'none'"],
    ["form-action", "'none'"],
  ];
  return directives.map(([name, sources]) => `${name} ${sources}`).join("; ");
}

/** @param {"cdn" | "local"} officeJs */
function officeJsUrl(officeJs) {
  return officeJs === "cdn" ? OFFICE_JS_CDN : OFFICE_JS_LOCAL;
}

module.exports = { contentPolicy, officeJsUrl, OFFICE_JS_CDN };
