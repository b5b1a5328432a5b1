// The usual caution wherever crop guidance mentions sprays, soaps, oils, lime, manure or fertiliser;
// kept apart from the catalogue so pages can show it without loading the crop data.

/** The caution every guidance text carries when it talks about sprays, soaps, oils, lime, manure or fertiliser. */
export const SAFETY_CAUTION =
  'Follow the product label, wear gloves and eye protection, keep sprays off open flowers and foraging pollinators, and defer to local regulations and licensed advice.';

/** Words in guidance that call for the safety caution. */
export const CAUTION_WORDS = /\b(spray|soap|oil|lime|liming|manur|fertili[sz]|pesticid|fungicid)\w*/i;

