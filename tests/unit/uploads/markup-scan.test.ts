import { describe, expect, it } from "vitest";
import { findEmbeddedMarkup } from "@/lib/uploads/markup-scan";
import { jpegWithCameraMetadata, jpegWithComment, noisePixels } from "../../support/files";

const text = (value: string) => new Uint8Array(Buffer.from(value, "latin1"));

describe("findEmbeddedMarkup: polyglot files", () => {
  it("finds script and server code hidden in an otherwise valid JPEG, in any letter case", async () => {
    expect(findEmbeddedMarkup(await jpegWithComment("<ScRiPt>fetch('/api')</script>"))).toBe("<script");
    expect(findEmbeddedMarkup(await jpegWithComment("<?php system($_GET['c']); ?>"))).toBe("<?php");
    expect(findEmbeddedMarkup(await jpegWithComment("<iframe src=//x>"))).toBe("<iframe");
  });

  it("finds page and drawing markers, and javascript: URLs", () => {
    expect(findEmbeddedMarkup(text("\xff\xd8\xff...<html>"))).toBe("<html");
    expect(findEmbeddedMarkup(text("...<!DOCTYPE  html>"))).toBe("<!doctype html");
    expect(findEmbeddedMarkup(text('<g xmlns="http://www.w3.org/2000/svg">'))).toBe("an SVG document");
    expect(findEmbeddedMarkup(text("/URI (JavaScript :alert(1))"))).toBe("javascript:");
    // Markup appended after the image's end (after EOI) counts as much as markup inside it.
    expect(findEmbeddedMarkup(Buffer.concat([noisePixels(64, 1), Buffer.from("<body onload=x>")]))).toBe("<body");
  });

  it("passes photos and data that only contain look-alikes", async () => {
    expect(findEmbeddedMarkup(await jpegWithCameraMetadata())).toBeNull();
    expect(findEmbeddedMarkup(noisePixels(512, 512))).toBeNull();
    expect(findEmbeddedMarkup(text("time_s,bus_V\n0.000,325.1\n0.001,324.9\n"))).toBeNull();
    // Words that merely start like a tag are not markup.
    expect(findEmbeddedMarkup(text("<htmlish> <bodyguard> <embedded> scripted"))).toBeNull();
  });
});
