/**
 * Certificates for `npm start`. On Linux as root without sudo, the dev-certs "install" command
 * creates the files but cannot trust the CA (it calls sudo) and still exits 0, and
 * getHttpsServerOptions() throws. So: read the CA and the localhost certificate made earlier and
 * reuse them while both stay valid for more than a day, so the user trusts the CA once and not at
 * every start; only when one is missing or about to expire, make a new set with the package's
 * generateCertificates() (valid 30 days; it keeps no CA key, so a new localhost certificate
 * always comes with a new CA). If anything fails, the caller falls back to plain http on
 * 127.0.0.1 and says so.
 */
/* eslint-disable @typescript-eslint/no-require-imports -- a CommonJS file, loaded by webpack-cli */
const fs = require("node:fs");
const crypto = require("node:crypto");
const devCerts = require("office-addin-dev-certs");
const defaults = require("office-addin-dev-certs/lib/defaults");

const DAY = 24 * 3600 * 1000;

const certificatePaths = {
  ca: defaults.caCertificatePath,
  cert: defaults.localhostCertificatePath,
  key: defaults.localhostKeyPath,
};

/** When the certificate at `path` expires (ms since 1970), or undefined if unreadable. */
function expiry(path) {
  try {
    const expires = Date.parse(new crypto.X509Certificate(fs.readFileSync(path)).validTo);
    return Number.isFinite(expires) ? expires : undefined;
  } catch {
    return undefined;
  }
}

/** The earlier expiry of the CA and the localhost certificate, when both are there and readable. */
function setExpiry(paths) {
  if (!fs.existsSync(paths.key)) return undefined;
  const ca = expiry(paths.ca);
  const cert = expiry(paths.cert);
  return ca === undefined || cert === undefined ? undefined : Math.min(ca, cert);
}

/**
 * Resolves to `{ https: { ca, cert, key }, caPath, reused, daysLeft }` when certificates are
 * ready, or to `{ https: undefined, problem }` when they could not be made.
 */
async function devCertificates(paths = certificatePaths, now = Date.now()) {
  try {
    let expires = setExpiry(paths);
    const reused = expires !== undefined && expires > now + DAY;
    if (!reused) {
      // generateCertificates() writes nothing while an old ca.crt exists, so clear stale files.
      for (const p of Object.values(paths)) fs.rmSync(p, { force: true });
      await devCerts.generateCertificates(paths.ca, paths.cert, paths.key);
      expires = setExpiry(paths);
    }
    return {
      https: {
        ca: fs.readFileSync(paths.ca),
        cert: fs.readFileSync(paths.cert),
        key: fs.readFileSync(paths.key),
      },
      caPath: paths.ca,
      reused,
      daysLeft: expires === undefined ? 0 : Math.floor((expires - now) / DAY),
    };
  } catch (error) {
    return { https: undefined, problem: error instanceof Error ? error.message : String(error) };
  }
}

module.exports = { devCertificates, certificatePaths };
