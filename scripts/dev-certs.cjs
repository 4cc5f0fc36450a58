/**
 * Certificates for `npm start`. On Linux as root without sudo, the dev-certs "install" command
 * creates the files but cannot trust the CA (it calls sudo) and still exits 0, and
 * getHttpsServerOptions() throws. So: create the CA and the localhost certificate with the
 * package's generateCertificates() when they are missing or expired, read the three files, and
 * leave trusting the CA to the user, with instructions. If anything fails, the caller falls back
 * to plain http on 127.0.0.1 and says so.
 */
/* eslint-disable @typescript-eslint/no-require-imports -- a CommonJS file, loaded by webpack-cli */
const fs = require("node:fs");
const crypto = require("node:crypto");
const devCerts = require("office-addin-dev-certs");
const defaults = require("office-addin-dev-certs/lib/defaults");

const paths = {
  ca: defaults.caCertificatePath,
  cert: defaults.localhostCertificatePath,
  key: defaults.localhostKeyPath,
};

function stillValid(certificatePath) {
  try {
    const certificate = new crypto.X509Certificate(fs.readFileSync(certificatePath));
    return Date.parse(certificate.validTo) > Date.now() + 24 * 3600 * 1000;
  } catch {
    return false;
  }
}

/**
 * Resolves to `{ https: { ca, cert, key }, caPath }` when certificates are ready, or to
 * `{ https: undefined, problem }` when they could not be made.
 */
async function devCertificates() {
  try {
    const present = Object.values(paths).every((p) => fs.existsSync(p));
    if (!present || !stillValid(paths.cert)) {
      // generateCertificates() writes nothing while an old ca.crt exists, so clear stale files.
      for (const p of Object.values(paths)) fs.rmSync(p, { force: true });
      await devCerts.generateCertificates(paths.ca, paths.cert, paths.key);
    }
    return {
      https: {
        ca: fs.readFileSync(paths.ca),
        cert: fs.readFileSync(paths.cert),
        key: fs.readFileSync(paths.key),
      },
      caPath: paths.ca,
    };
  } catch (error) {
    return { https: undefined, problem: error instanceof Error ? error.message : String(error) };
  }
}

module.exports = { devCertificates, certificatePaths: paths };
