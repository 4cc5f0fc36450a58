import { describe, expect, it } from "vitest";
import { lagTable } from "../../src/core";
import { reportHtml, SCREENING_CAUTION } from "../../src/report";
import { seriesF } from "./chartTree";

describe("reportHtml(input)", () => {
  const series = seriesF("<img src=x onerror=alert(1)>");
  const html = reportHtml({
    table: lagTable(series, {}),
    squares: lagTable(series, { testKind: "squares" }),
    source: "f.csv",
  });

  it("is self-contained: no script, no external resource, a CSP that allows nothing else", () => {
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/<[a-z][^>]*\s(src|href)=/i);
    expect(html.replace(/http:\/\/www\.w3\.org\/2000\/svg/g, "")).not.toMatch(/https?:\/\//);
    expect(html).toContain(`content="default-src 'none'; style-src 'unsafe-inline'"`);
  });

  it("holds the badge, three evidence charts, the ribbon, the explanation and the caution", () => {
    expect(html.match(/<svg[^>]*class="evidence-chart/g)).toHaveLength(3);
    expect(html).toContain('class="joint-ribbon"');
    expect(html).toContain('data-word="structure"');
    expect(html).toContain("would cross the band by chance");
    expect(html).toContain(SCREENING_CAUTION);
    expect(html.match(/<table class="figures">/g)).toHaveLength(3);
  });

  it("escapes the label everywhere", () => {
    expect(html).not.toContain("<img");
    expect(html).toContain("<h1>&lt;img src=x onerror=alert(1)&gt;</h1>");
    expect(html).toContain("<title>Echolot report: &lt;img src=x onerror=alert(1)&gt;</title>");
  });

  it("is deterministic", () => {
    expect(
      reportHtml({
        table: lagTable(series, {}),
        squares: lagTable(series, { testKind: "squares" }),
        source: "f.csv",
      }),
    ).toBe(html);
  });
});
