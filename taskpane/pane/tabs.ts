/**
 * Keyboard use of the chart tabs, as the tab pattern expects: arrow keys move between tabs,
 * Home and End jump to the ends, and the chosen tab is the only one in the tab order.
 */
import type { ChartView } from "../../src/report";

export function wireTabs(
  tabs: readonly HTMLButtonElement[],
  choose: (view: ChartView) => void,
): void {
  const pick = (index: number) => {
    const tab = tabs[(index + tabs.length) % tabs.length];
    if (tab === undefined) return;
    tab.focus();
    choose(tab.dataset.view as ChartView);
  };
  tabs.forEach((tab, index) => {
    tab.addEventListener("click", () => choose(tab.dataset.view as ChartView));
    tab.addEventListener("keydown", (event) => {
      const moves: Record<string, number> = {
        ArrowRight: index + 1,
        ArrowLeft: index - 1,
        Home: 0,
        End: tabs.length - 1,
      };
      const target = moves[event.key];
      if (target === undefined) return;
      event.preventDefault();
      pick(target);
    });
  });
}
