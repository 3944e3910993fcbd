// What the photo figures mean, in the words shown under every photo (visit page, report, zone
// page). US English on screen.
import { LIGHTING, type Lighting } from "@/lib/photo-analysis/color";

/** One sentence for readers who wonder what the two figures are. */
export const PHOTO_FIGURES_EXPLAINED =
  "Green canopy cover is the share of the photo where green leaves show (the pixel rule of Patrignani & Ochsner, 2015). DGCI rates how dark green those leaves are, from 0 (yellow) to 1 (very dark green; Karcher & Richardson, 2003). Yellowing grass counts as canopy while it still has a green tinge and lowers the DGCI; grass yellowed further, straw and dead grass count as uncovered.";

/** The same for a homeowner: the green cover only, without the imaging index. */
export const PHOTO_COVER_EXPLAINED =
  "Green cover is the share of the photo where green leaves show, measured from the photo itself (the method of Patrignani & Ochsner, 2015). Yellowed grass, straw and dead grass count as uncovered.";

/** The lighting caution of a photo, or null when its light let it be measured. */
export function lightingCaution(photo: {
  lighting: Lighting;
  darkPct: number;
  clippedPct: number;
}): { title: string; detail: string } | null {
  const after =
    "The figures may be off by that much, so they are not counted in the Sward Index. Retake the photo in even daylight, without deep shade or glare.";
  switch (photo.lighting) {
    case "ok":
      return null;
    case "too_dark":
      return {
        title: "Too dark to measure",
        detail: `${photo.darkPct} % of the photo is too dark to read (the limit is ${LIGHTING.maxDarkPct} %). ${after}`,
      };
    case "too_bright":
      return {
        title: "Too bright to measure",
        detail: `${photo.clippedPct} % of the photo is washed out (the limit is ${LIGHTING.maxClippedPct} %). ${after}`,
      };
    case "dark_and_bright":
      return {
        title: "Light too harsh to measure",
        detail: `${photo.darkPct} % of the photo is too dark to read and ${photo.clippedPct} % is washed out. ${after}`,
      };
  }
}
