import { describe, expect, it } from "vitest";
import { safeNextPath } from "@/lib/http/safe-path";

// The WHATWG URL Standard's parser, which browsers apply to a Location header, treats "\" as "/"
// in special schemes and strips ASCII tab and newline; so each of these resolves to another host
// ("http://evil.example/") from a page on this site. Node's URL is the same parser, which the
// first check confirms.

const HOSTILE = ["//evil.example", "/\\evil.example", "/\\\\evil.example", "/\t/evil.example", "/\n/evil.example", "\\\\evil.example", "https://evil.example/", "javascript:alert(1)", "evil.example", ""];

describe("safeNextPath", () => {
  it("the browser's parser does send these elsewhere (the premise)", () => {
    for (const path of ["//evil.example", "/\\evil.example", "/\t/evil.example"]) expect(new URL(path, "http://localhost:3000").host).toBe("evil.example");
  });

  it("keeps paths on this site, with their query and fragment", () => {
    expect(safeNextPath("/sell/listings/new?kind=board")).toBe("/sell/listings/new?kind=board");
    expect(safeNextPath("/questions/new?listing=abc#ask")).toBe("/questions/new?listing=abc#ask");
    expect(safeNextPath("/")).toBe("/");
  });

  it("falls back for anything a browser would take to another host, or that is not a path", () => {
    for (const path of HOSTILE) expect(safeNextPath(path), JSON.stringify(path)).toBe("/account");
    expect(safeNextPath(undefined, "/orders")).toBe("/orders");
  });
});
