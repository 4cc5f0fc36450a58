/**
 * A refused setting, as the form shows it: the field is marked (aria-invalid, and described by
 * the message), and the core's message speaks the label's own words ("Max lag must be…", never
 * "maxLag must be…"), read from the form's labels so the two can never drift apart.
 */
import { capitalise } from "../../src/core";
import { SETTING_NAMES, type SettingName } from "./settings";

/** The setting a core message is about: the option name it starts with, if any. */
export function settingOfMessage(message: string): SettingName | undefined {
  return SETTING_NAMES.find((name) => new RegExp(`^${name}\\b`).test(message));
}

function control(form: HTMLFormElement, name: SettingName): HTMLElement | null {
  const found = form.elements.namedItem(name);
  return found instanceof HTMLInputElement || found instanceof HTMLSelectElement ? found : null;
}

/** A setting's label as the form shows it ("Max lag"), or its option name without a label. */
function labelText(form: HTMLFormElement, name: SettingName): string {
  const field = control(form, name);
  const label = field === null ? null : form.querySelector(`label[for="${field.id}"]`);
  return label?.textContent?.trim() || name;
}

/**
 * The message with every option name in the label's words: capitalised at the start of the
 * sentence, lower case within it ("must be below max lag").
 */
export function inLabelWords(form: HTMLFormElement, message: string): string {
  let text = message;
  for (const name of SETTING_NAMES) {
    const label = labelText(form, name);
    text = text.replace(new RegExp(`\\b${name}\\b`, "g"), (_match, offset: number) =>
      offset === 0 ? label : label.charAt(0).toLowerCase() + label.slice(1),
    );
  }
  return capitalise(text);
}

/** Marks the refused field (or none) invalid, described by the problem's message. */
export function markInvalid(
  form: HTMLFormElement,
  refused: SettingName | undefined,
  problem: HTMLElement,
): void {
  for (const name of SETTING_NAMES) {
    const field = control(form, name);
    if (field === null) continue;
    const described = (field.getAttribute("aria-describedby") ?? "")
      .split(/\s+/)
      .filter((id) => id !== "" && id !== problem.id);
    if (name === refused) {
      field.setAttribute("aria-invalid", "true");
      described.push(problem.id);
    } else {
      field.removeAttribute("aria-invalid");
    }
    if (described.length > 0) field.setAttribute("aria-describedby", described.join(" "));
    else field.removeAttribute("aria-describedby");
  }
}
