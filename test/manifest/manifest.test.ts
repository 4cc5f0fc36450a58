/**
 * manifest/manifest.xml: well-formed XML, elements in the order the add-in manifest schema's
 * sequences require, a shared runtime, namespace ECHOLOT, unique ids, every resource id
 * resolved, and every URL pointing at a file the build emits into dist/ (built by npm test before
 * vitest). The order lists are the schema's sequences (OfficeApp 1.1 TaskPaneApp and
 * VersionOverrides 1.0, as published with the schema files), restricted to the elements we use.
 */
import { existsSync, readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { DIST, distFile } from "../functions/host";
import { at, child, descendants, parseXml, type XmlElement } from "./xml";

const MANIFEST = join(
  dirname(fileURLToPath(import.meta.url)),
  "..",
  "..",
  "manifest",
  "manifest.xml",
);
const source = readFileSync(MANIFEST, "utf8");
const root = parseXml(source);
const APP_NS = "http://schemas.microsoft.com/office/appforoffice/1.1";
const OVERRIDES_NS = "http://schemas.microsoft.com/office/taskpaneappversionoverrides";
const BT_NS = "http://schemas.microsoft.com/office/officeappbasictypes/1.0";
const SERVER = "https://localhost:3000/";

/** The elements' names must appear in this relative order (a subsequence of `order`). */
function expectOrder(element: XmlElement, order: readonly string[]): void {
  const names = element.children.map((c) => c.name);
  for (const name of names) {
    expect(order, `<${name}> is not expected inside <${element.name}>`).toContain(name);
  }
  const positions = names.map((name) => order.indexOf(name));
  const sorted = [...positions].sort((a, b) => a - b);
  expect(names, `children of <${element.name}> out of schema order`).toEqual(
    sorted.map((p) => order[p]),
  );
}

const overrides = child(root, "VersionOverrides");
const workbook = at(overrides, "Hosts", "Host");
const resources = child(overrides, "Resources");

function resourceIds(kind: string): Map<string, string> {
  const group = child(resources, `bt:${kind}`);
  return new Map(
    group.children.map((c) => [c.attributes.id ?? "", c.attributes.DefaultValue ?? ""]),
  );
}
const urls = resourceIds("Urls");
const images = resourceIds("Images");
const shortStrings = resourceIds("ShortStrings");
const longStrings = resourceIds("LongStrings");

function pngSize(path: string): [number, number] {
  const bytes = readFileSync(path);
  expect(bytes.subarray(1, 4).toString("ascii"), `${path} is a PNG`).toBe("PNG");
  return [bytes.readUInt32BE(16), bytes.readUInt32BE(20)];
}

describe("manifest/manifest.xml", () => {
  it("is a TaskPaneApp in the add-in manifest namespace", () => {
    expect(root.name).toBe("OfficeApp");
    expect(root.uri).toBe(APP_NS);
    expect(root.attributes["xsi:type"]).toBe("TaskPaneApp");
    expect(overrides.uri).toBe(OVERRIDES_NS);
    expect(overrides.attributes["xsi:type"]).toBe("VersionOverridesV1_0");
    expect(child(resources, "bt:Urls").uri).toBe(BT_NS);
  });

  it("lists OfficeApp's elements in schema order, with a GUID id and a four-part version", () => {
    expectOrder(root, [
      "Id",
      "AlternateId",
      "Version",
      "ProviderName",
      "DefaultLocale",
      "DisplayName",
      "Description",
      "IconUrl",
      "HighResolutionIconUrl",
      "SupportUrl",
      "AppDomains",
      "Hosts",
      "Requirements",
      "DefaultSettings",
      "Permissions",
      "VersionOverrides",
    ]);
    expect(child(root, "Id").text).toMatch(
      /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i,
    );
    expect(child(root, "Version").text).toMatch(/^\d+\.\d+\.\d+\.\d+$/);
    expect(at(root, "Hosts", "Host").attributes.Name).toBe("Workbook");
    expect(child(root, "Permissions").text).toBe("ReadWriteDocument");
  });

  it("requires SharedRuntime 1.1 and runs one long-lived runtime on the pane page", () => {
    const sets = at(root, "Requirements", "Sets").children;
    expect(sets.map((s) => [s.attributes.Name, s.attributes.MinVersion])).toContainEqual([
      "SharedRuntime",
      "1.1",
    ]);
    expect(workbook.attributes["xsi:type"]).toBe("Workbook");
    expectOrder(workbook, ["Runtimes", "AllFormFactors", "DesktopFormFactor", "MobileFormFactor"]);
    const runtime = at(workbook, "Runtimes", "Runtime");
    expect(runtime.attributes).toMatchObject({ resid: "Taskpane.Url", lifetime: "long" });
    expect(at(workbook, "DesktopFormFactor", "FunctionFile").attributes.resid).toBe("Taskpane.Url");
  });

  it("declares the custom functions: script, page, metadata and namespace ECHOLOT, in order", () => {
    const point = at(workbook, "AllFormFactors", "ExtensionPoint");
    expect(point.attributes["xsi:type"]).toBe("CustomFunctions");
    expect(point.children.map((c) => c.name)).toEqual(["Script", "Page", "Metadata", "Namespace"]);
    const resid = (name: string) => at(point, name, "SourceLocation").attributes.resid ?? "";
    expect(urls.get(resid("Script"))).toBe(`${SERVER}functions.js`);
    expect(urls.get(resid("Page"))).toBe(`${SERVER}taskpane.html`);
    expect(urls.get(resid("Metadata"))).toBe(`${SERVER}functions.json`);
    const namespace = shortStrings.get(child(point, "Namespace").attributes.resid ?? "");
    expect(namespace).toBe("ECHOLOT");
    expect((namespace ?? "").length).toBeLessThanOrEqual(32);
  });

  it("puts a ribbon button that opens the pane, with labels, tooltip and icons", () => {
    const desktop = child(workbook, "DesktopFormFactor");
    expectOrder(desktop, ["GetStarted", "SxsFallback", "FunctionFile", "ExtensionPoint"]);
    const group = at(desktop, "ExtensionPoint", "OfficeTab", "Group");
    expectOrder(group, ["Label", "Icon", "Control"]);
    const button = child(group, "Control");
    expect(button.attributes["xsi:type"]).toBe("Button");
    expectOrder(button, ["Label", "Supertip", "Icon", "Action"]);
    const action = child(button, "Action");
    expect(action.attributes["xsi:type"]).toBe("ShowTaskpane");
    expectOrder(action, ["TaskpaneId", "SourceLocation"]);
    expect(urls.get(child(action, "SourceLocation").attributes.resid ?? "")).toBe(
      `${SERVER}taskpane.html`,
    );
    const label = shortStrings.get(child(button, "Label").attributes.resid ?? "") ?? "";
    expect(label.length, "button label").toBeGreaterThan(3);
    const tooltip =
      longStrings.get(at(button, "Supertip", "Description").attributes.resid ?? "") ?? "";
    expect(tooltip.length, "button tooltip").toBeGreaterThan(20);
  });

  it("keeps resources in schema order, their ids unique and within 32 characters", () => {
    expectOrder(resources, ["bt:Images", "bt:Urls", "bt:ShortStrings", "bt:LongStrings"]);
    const ids = resources.children.flatMap((group) =>
      group.children.map((c) => c.attributes.id ?? ""),
    );
    expect(new Set(ids).size, `resource ids ${ids.join(", ")}`).toBe(ids.length);
    for (const id of ids) expect(id.length, id).toBeLessThanOrEqual(32);
    for (const [id, text] of shortStrings) expect(text.length, id).toBeLessThanOrEqual(125);
    for (const [id, text] of longStrings) expect(text.length, id).toBeLessThanOrEqual(250);
  });

  it("gives unique control, group and tab ids", () => {
    const ids = descendants(overrides)
      .filter((e) => ["Group", "Control"].includes(e.name))
      .map((e) => e.attributes.id ?? "");
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ids) expect(id).toMatch(/^Echolot\./);
  });

  it("resolves every resid to a resource of the right kind", () => {
    const kindFor: Record<string, Map<string, string>> = {
      SourceLocation: urls,
      Runtime: urls,
      FunctionFile: urls,
      "bt:Image": images,
      Label: shortStrings,
      Title: shortStrings,
      Namespace: shortStrings,
      Description: longStrings,
    };
    const withResid = descendants(overrides).filter((e) => e.attributes.resid !== undefined);
    expect(withResid.length).toBeGreaterThan(10);
    for (const element of withResid) {
      const table = kindFor[element.name];
      if (table === undefined) throw new Error(`unexpected resid on <${element.name}>`);
      expect(
        table.has(element.attributes.resid ?? ""),
        `<${element.name} resid="${element.attributes.resid}">`,
      ).toBe(true);
    }
  });

  it("points every URL at a file the build emits, served on localhost:3000", () => {
    const addresses = [
      ...source.matchAll(/"(https?:\/\/[^"]+)"/g),
      ...source.matchAll(/>(https?:\/\/[^<]+)</g),
    ].map((m) => m[1] as string);
    const served = addresses.filter(
      (a) => !a.startsWith("http://schemas.microsoft.com/") && !a.startsWith("http://www.w3.org/"),
    );
    expect(served.length).toBeGreaterThan(8);
    for (const address of served) {
      expect(address.startsWith(SERVER), `${address} is not served by npm start`).toBe(true);
      const file = join(DIST, address.slice(SERVER.length));
      expect(existsSync(file), `${address}: dist has no ${file} (run npm run build)`).toBe(true);
    }
  });

  it("uses icons of the sizes it declares", () => {
    const checks: [string, number][] = [
      [child(root, "IconUrl").attributes.DefaultValue ?? "", 32],
      [child(root, "HighResolutionIconUrl").attributes.DefaultValue ?? "", 64],
      ...child(resources, "bt:Images").children.map((c): [string, number] => [
        c.attributes.DefaultValue ?? "",
        Number((c.attributes.id ?? "").split(".")[1]),
      ]),
    ];
    for (const [address, size] of checks) {
      const file = distFile(address.slice(SERVER.length));
      expect(pngSize(file), address).toEqual([size, size]);
    }
  });
});
