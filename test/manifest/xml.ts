/**
 * A small element tree from a strict, namespace-aware XML parse (saxes): enough to walk the
 * manifest. Parsing throws on anything that is not well-formed XML.
 */
import { SaxesParser } from "saxes";

export interface XmlElement {
  /** Qualified name as written, e.g. "bt:Image". */
  readonly name: string;
  /** Local name, e.g. "Image". */
  readonly local: string;
  readonly uri: string;
  readonly attributes: Readonly<Record<string, string>>;
  readonly children: XmlElement[];
  text: string;
}

export function parseXml(source: string): XmlElement {
  const parser = new SaxesParser({ xmlns: true });
  const stack: XmlElement[] = [];
  let root: XmlElement | undefined;
  parser.on("opentag", (tag) => {
    const attributes: Record<string, string> = {};
    for (const attribute of Object.values(tag.attributes))
      attributes[attribute.name] = attribute.value;
    const element: XmlElement = {
      name: tag.name,
      local: tag.local,
      uri: tag.uri,
      attributes,
      children: [],
      text: "",
    };
    const parent = stack[stack.length - 1];
    if (parent === undefined) root = element;
    else parent.children.push(element);
    stack.push(element);
  });
  parser.on("text", (text) => {
    const current = stack[stack.length - 1];
    if (current !== undefined) current.text += text;
  });
  parser.on("closetag", () => {
    stack.pop();
  });
  parser.write(source).close();
  if (root === undefined) throw new Error("no root element");
  return root;
}

/** Every element below (and including) `element`, depth first. */
export function descendants(element: XmlElement): XmlElement[] {
  return [element, ...element.children.flatMap(descendants)];
}

/** The one child with this qualified name; throws if there is none or several. */
export function child(element: XmlElement, name: string): XmlElement {
  const found = element.children.filter((c) => c.name === name);
  if (found.length !== 1) {
    throw new Error(`<${element.name}> has ${found.length} <${name}> children, expected 1`);
  }
  return found[0] as XmlElement;
}

/** Follows a path of qualified names, one child at each step. */
export function at(element: XmlElement, ...path: string[]): XmlElement {
  return path.reduce(child, element);
}
