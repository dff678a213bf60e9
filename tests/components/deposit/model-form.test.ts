import { describe, expect, it } from "vitest";
import {
  EMPTY_MODEL_FORM,
  formErrors,
  isModelFormValues,
  toModelInput,
  validateModelForm,
  type ModelFormValues,
} from "@/components/deposit/model-form";

const base: ModelFormValues = { ...EMPTY_MODEL_FORM, title: "Cache raiding among fictional jays" };

describe("validateModelForm", () => {
  it("accepts a title alone (blank author rows are dropped)", () => {
    expect(validateModelForm(base)).toEqual({});
    expect(toModelInput(base).authors).toEqual([]);
  });

  it("asks for a title", () => {
    expect(validateModelForm({ ...base, title: "  " })).toEqual({ "/title": "The model needs a title." });
  });

  it("checks ORCID iDs by their check character", () => {
    // ORCID's own documented example iD 0000-0002-1825-0097 (support.orcid.org); the last digit changed breaks it.
    const ok = { ...base, authors: [{ name: "R. Finch", orcid: "https://orcid.org/0000-0002-1825-0097", affiliation: "" }] };
    expect(validateModelForm(ok)).toEqual({});
    const bad = { ...base, authors: [{ name: "R. Finch", orcid: "0000-0002-1825-0098", affiliation: "" }] };
    expect(validateModelForm(bad)).toEqual({
      "/authors/0/orcid": "Not a valid ORCID iD (0000-0000-0000-000X with a correct check character).",
    });
  });

  it("points at the form row the author sees, after blank rows in between", () => {
    const v = {
      ...base,
      authors: [
        { name: "A. Wren", orcid: "", affiliation: "" },
        { name: "", orcid: "", affiliation: "" },
        { name: "", orcid: "0000-0002-1825-0097", affiliation: "" },
      ],
    };
    expect(validateModelForm(v)).toEqual({ "/authors/2/name": "An author needs a name." });
  });

  it("checks DOI, web address and year", () => {
    expect(validateModelForm({ ...base, doi: "doi:10.1/x", url: "ftp://x", year: "20x4" })).toEqual({
      "/doi": "Not a DOI (10.NNNN/...).",
      "/url": "Not a web address (http:// or https://).",
      "/year": "A year in digits, e.g. 2024.",
    });
    expect(validateModelForm({ ...base, year: "1850" })).toEqual({ "/year": "A year from 1900 on." });
    expect(validateModelForm({ ...base, doi: "https://doi.org/10.5555/jay.2024", year: "2024" })).toEqual({});
  });
});

describe("formErrors", () => {
  it("maps server problems to form rows and keeps the first message per field", () => {
    const v = { ...base, authors: [{ name: "", orcid: "", affiliation: "" }, { name: "B", orcid: "x", affiliation: "" }] };
    expect(
      formErrors(v, [
        { path: "/authors/0/orcid", message: "first" },
        { path: "/authors/0/orcid", message: "second" },
        { path: "/venueId", message: "No such venue." },
      ]),
    ).toEqual({ "/authors/1/orcid": "first", "/venueId": "No such venue." });
  });
});

describe("isModelFormValues", () => {
  it("accepts the form's own shape and refuses anything else", () => {
    expect(isModelFormValues(base)).toBe(true);
    expect(isModelFormValues({ ...base, visibility: "hidden" })).toBe(false);
    expect(isModelFormValues({ ...base, authors: [{ name: 1 }] })).toBe(false);
    expect(isModelFormValues(null)).toBe(false);
  });
});
