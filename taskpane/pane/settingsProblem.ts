/**
 * A refused setting, as the form shows it: the field is marked (aria-invalid, and described by
 * the message), and the core's message speaks the label's own words ("Max lag must be…", never
 * "maxLag must be…"), read from the form's labels so the two can never drift apart.
 */
import { capitalise, type EcholotError } from "../../src/core";
import { SETTING_NAMES, type SettingName } from "./settings";

/** The setting a refusal is about: the parameter it refuses, when the form has a field for it. */
export function refusedSetting(error: EcholotError): SettingName | undefined {
  const name = error.parameter?.name;
  return SETTING_NAMES.find((setting) => setting === name);
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
 * The refusal as the pane says it, a sentence: a refused setting is named by its label ("Max lag
 * must be…").
 */
export function inLabelWords(
  form: HTMLFormElement,
  error: EcholotError,
  setting: SettingName | undefined,
): string {
  const text =
    setting === undefined ? error.message : error.messageNaming(labelText(form, setting));
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
