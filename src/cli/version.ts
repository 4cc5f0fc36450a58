/**
 * Echolot's version, from package.json. The bundler inlines the one field at build time
 * (scripts/build-cli.mjs), so the built CLI reads no file to know it.
 */
import { version } from "../../package.json";

export const ECHOLOT_VERSION: string = version;
