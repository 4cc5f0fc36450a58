/**
 * The ranked table of a block's items, most telling first: each item's name is a button that
 * shows the item (a native button, so Tab reaches it and Enter or Space presses it; the arrow
 * keys move between rows), the item shown is marked `aria-current`, the rows the false-discovery
 * step keeps are marked (class and a visible word), and a cut-off line follows the last kept row.
 * Text goes in as text (textContent), never as markup. Order, kept mark and figures come from
 * src/report/rankedList.ts.
 */
import {
  keptWords,
  rankedPText,
  verdictCellText,
  type RankedItem,
  type RankedList,
} from "../../src/report";

function cell(tag: "td" | "th", text: string, className?: string): HTMLTableCellElement {
  const element = document.createElement(tag);
  element.textContent = text;
  if (className !== undefined) element.className = className;
  return element;
}

/**
 * The figure columns: title, value, and class. A "fold-360" or "fold-330" column gives way in a
 * pane at most that wide and shows as a line under the item's name instead.
 */
function columns(list: RankedList): readonly [string, (item: RankedItem) => string, string][] {
  return list.kind === "audit"
    ? [
        ["q, lags", (item) => rankedPText(item.qValue), "figure"],
        ["q, bias", (item) => rankedPText(item.biasQValue), "figure"],
      ]
    : [
        ["p", (item) => rankedPText(item.p), "figure fold-360"],
        ["q-value", (item) => rankedPText(item.qValue), "figure"],
        ["bias q", (item) => rankedPText(item.biasQValue), "figure"],
        ["volatility p", (item) => rankedPText(item.volatilityP), "figure fold-330"],
      ];
}

function captionText(list: RankedList): string {
  const what = list.kind === "audit" ? "audited" : "checked";
  const steps = `the false-discovery step keeps lag structure and bias separately (q-value at most ${list.alpha})`;
  const kept =
    list.keptCount === 0
      ? "it keeps none"
      : `${list.keptCount} kept, first and above the cut-off line`;
  return `${list.items.length} items ${what}; ${steps}: ${kept}; then watch, clear and short. Choose an item to show it.`;
}

export class RankedTable {
  private buttons: HTMLButtonElement[] = [];

  constructor(
    private readonly host: HTMLElement,
    private readonly choose: (index: number) => void,
  ) {}

  render(list: RankedList, shown: number): void {
    const table = document.createElement("table");
    table.className = `ranked ${list.kind}`;
    table.createCaption().textContent = captionText(list);
    const figures = columns(list);
    const headRow = table.createTHead().insertRow();
    const heads: [string, string][] = [
      ["#", "rank"],
      ["item", "item"],
      ...figures.map(([title, , className]): [string, string] => [title, className]),
      ["verdict", "verdict"],
    ];
    for (const [title, className] of heads) {
      const th = cell("th", title, className);
      th.scope = "col";
      headRow.append(th);
    }
    const body = table.createTBody();
    this.buttons = [];
    list.items.forEach((item, position) => {
      const row = body.insertRow();
      if (item.kept) row.className = "kept";
      row.append(cell("td", String(item.rank), "rank"));
      const name = cell("th", "", "item");
      name.scope = "row";
      const button = document.createElement("button");
      button.type = "button";
      button.className = "item-button";
      button.dataset.index = String(item.index);
      button.textContent = item.label;
      button.title = item.reason;
      button.addEventListener("click", () => this.choose(item.index));
      button.addEventListener("keydown", (event) => this.move(event, position));
      name.append(button);
      if (item.kept) {
        const tag = document.createElement("span");
        tag.className = "kept-tag";
        tag.textContent = keptWords(item);
        name.append(tag);
      }
      // The figures a narrow pane folds away as columns, as a line under the name instead.
      for (const [title, value, className] of figures) {
        const fold = /fold-\d+/.exec(className)?.[0];
        if (fold === undefined) continue;
        const line = document.createElement("span");
        line.className = `folded ${fold}`;
        line.textContent = `${title} ${value(item)}`;
        name.append(line);
      }
      row.append(name);
      for (const [, value, className] of figures) row.append(cell("td", value(item), className));
      const verdict = cell("td", verdictCellText(item), "verdict");
      if (item.word !== null) verdict.dataset.word = item.word;
      row.append(verdict);
      this.buttons.push(button);
      const last = position === list.keptCount - 1 && list.keptCount < list.items.length;
      if (item.kept && last) {
        // One cell per column, so a column a narrow pane hides stays hidden on this row too.
        const cut = body.insertRow();
        cut.className = "cutoff";
        cut.append(cell("td", "", "rank"));
        cut.append(cell("td", `false-discovery cut-off: ${list.keptCount} kept above`, "cut-note"));
        for (const [, , className] of figures) cut.append(cell("td", "", className));
        cut.append(cell("td", "", "verdict"));
      }
    });
    this.host.replaceChildren(table);
    this.markShown(shown);
  }

  /** Marks the row of the item shown; the others lose the mark. */
  markShown(index: number): void {
    for (const button of this.buttons) {
      const current = Number(button.dataset.index) === index;
      if (current) button.setAttribute("aria-current", "true");
      else button.removeAttribute("aria-current");
      button.closest("tr")?.classList.toggle("shown", current);
    }
  }

  clear(): void {
    this.buttons = [];
    this.host.replaceChildren();
  }

  /** Arrow keys, Home and End move between the rows' buttons (Tab still walks them in order). */
  private move(event: KeyboardEvent, position: number): void {
    const moves: Record<string, number> = {
      ArrowDown: position + 1,
      ArrowUp: position - 1,
      Home: 0,
      End: this.buttons.length - 1,
    };
    const target = moves[event.key];
    const button = target === undefined ? undefined : this.buttons[target];
    if (button === undefined) return;
    event.preventDefault();
    button.focus();
  }
}
