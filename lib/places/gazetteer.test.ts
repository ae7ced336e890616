import { describe, expect, it } from "vitest";
import { distanceMeters } from "@/lib/geo/distance";
import { findPlaces, PLACES, placeByName } from "./gazetteer";

describe("gazetteer", () => {
  it("finds places by the start of their name first, ignoring case and accents", () => {
    expect(findPlaces("ka").map((p) => p.name).slice(0, 3)).toEqual(["Kafue", "Kabwe", "Kapiri Mposhi"]);
    expect(findPlaces("KÁFUE")[0]?.name).toBe("Kafue");
    expect(findPlaces("mposhi")[0]?.name).toBe("Kapiri Mposhi");
    expect(findPlaces("")).toEqual([]);
  });

  it("has unique names and coordinates inside the countries it names", () => {
    expect(new Set(PLACES.map((p) => p.name)).size).toBe(PLACES.length);
    // Zambia lies within about 8°S–18.1°S and 21.9°E–33.7°E (from memory).
    for (const p of PLACES.filter((x) => x.country === "ZM")) {
      expect(p.lat, p.name).toBeGreaterThan(-18.1);
      expect(p.lat, p.name).toBeLessThan(-8);
      expect(p.lng, p.name).toBeGreaterThan(21.9);
      expect(p.lng, p.name).toBeLessThan(33.8);
    }
  });

  it("places towns where road signs put them relative to the capital", () => {
    // Lusaka–Kabwe is about 110 km by road and roughly 108 km in a straight line (from memory, ±10 %).
    const lusaka = placeByName("Lusaka");
    const kabwe = placeByName("Kabwe");
    if (!lusaka || !kabwe) throw new Error("missing places");
    expect(distanceMeters(lusaka, kabwe) / 1000).toBeGreaterThan(97);
    expect(distanceMeters(lusaka, kabwe) / 1000).toBeLessThan(119);
  });
});
