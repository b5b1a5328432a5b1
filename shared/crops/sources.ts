import type { CropSource } from './types';

/**
 * Every publication (or mark) a crop value, rotation rule or relation points at. A value's
 * `source` must be one of these ids; the catalogue test walks the data to hold that.
 */
export const cropSources: CropSource[] = [
  {
    id: 'fao56-table11',
    title:
      'Allen, Pereira, Raes, Smith (1998), FAO Irrigation and Drainage Paper 56, Crop evapotranspiration, Table 11: lengths of crop development stages',
    evidence: 'published',
  },
  {
    id: 'fao56-table12',
    title:
      'Allen, Pereira, Raes, Smith (1998), FAO Irrigation and Drainage Paper 56, Crop evapotranspiration, Table 12: single crop coefficients Kc and mean maximum plant heights (read from the tables of the open pyfao56 package)',
    evidence: 'published',
  },
  {
    id: 'fao56-table22',
    title:
      'Allen, Pereira, Raes, Smith (1998), FAO Irrigation and Drainage Paper 56, Crop evapotranspiration, Table 22: ranges of maximum effective rooting depth (Zr) and soil water depletion fraction for no stress (p) (read from the tables of the open pyfao56 package)',
    evidence: 'published',
    // Read through the search tool in pyfao56 src/pyfao56/tools/tables.py; the vegetable rows
    // agree with a second, independent copy of the table found in the same search.
    url: 'https://github.com/kthorp/pyfao56/blob/main/src/pyfao56/tools/tables.py',
  },
  {
    id: 'umaine-planting-chart',
    title: 'University of Maine Cooperative Extension, Planting chart for the home vegetable garden',
    evidence: 'published',
  },
  {
    id: 'uarizona-intensive',
    title: 'University of Arizona Cooperative Extension, Intensive gardening methods (equal spacing table; second-hand copy)',
    evidence: 'published',
  },
  {
    id: 'osu-germination',
    title:
      'Oregon State University Extension, Soil temperature conditions for vegetable seed germination (J. F. Harrington; published April 2013, reviewed 2024)',
    evidence: 'published',
    // Read through the search tool: the chard, eggplant, parsley and parsnip rows and the
    // days-to-seedlings rows for cabbage, corn and cucumber come from this page.
    url: 'https://extension.oregonstate.edu/gardening/soil-compost/soil-temperature-conditions-vegetable-seed-germination',
  },
  {
    id: 'harrington-emergence',
    title:
      "Harrington and Minges, days to seedling emergence at soil temperatures 50–86 °F, as reprinted in Knott's Handbook for Vegetable Growers",
    evidence: 'published',
  },
  {
    id: 'tofg-emergence',
    title:
      'Teaching Organic Farming and Gardening, Unit 1.3 Propagation/Greenhouse Management, Appendix 4: Days required for seedling emergence at various soil temperatures from seed planted ½ inch deep (adapted from Harrington and Minges, Vegetable Seed Germination, California Agricultural Extension leaflet, 1954, via Knott\'s Handbook for Vegetable Growers, 1997)',
    evidence: 'published',
    // Read through the search tool in a copy on issuhub; its rows agree with the Harrington rows
    // already cited from sources.md (radish, lettuce, carrot, beet, tomato, snap bean, pepper).
    url: 'https://issuhub.com/view/index?id=3972&pageIndex=132',
  },
  {
    id: 'tofg-emergence-span',
    title:
      'Computed: the fewest and most days to emergence at 59, 68, 77 and 86 °F (15–30 °C) in the Harrington and Minges table of Teaching Organic Farming and Gardening, Appendix 4',
    evidence: 'computed',
    url: 'https://issuhub.com/view/index?id=3972&pageIndex=132',
  },
  {
    id: 'britannica-maturity',
    title: 'Encyclopaedia Britannica, Vegetable farming: harvesting (days to maturity)',
    evidence: 'published',
  },
  {
    id: 'umass-storage',
    title: 'UMass Amherst Extension Vegetable Program, Optimal storage conditions and ethylene sensitivity of fall storage crops',
    evidence: 'published',
    // Read through the search tool.
    url: 'https://ag.umass.edu/node/23531',
  },
  {
    id: 'nevmg-table16',
    title:
      'New England Vegetable Management Guide (the New England university extension services), Table 16: Handling produce for higher quality and longer market life (temperatures, humidity and storage life adapted from USDA Handbook 66)',
    evidence: 'published',
    // Read through the search tool; the rows from asparagus down to early potatoes were in the
    // stored copy, the later rows (spinach, squash, sweet corn, tomato) were not.
    url: 'https://nevegetable.org/cultural-practices/table-16-handling-produce-higher-quality-and-longer-market-life',
  },
  {
    id: 'purdue-frost-resistance',
    title:
      'Purdue University Cooperative Extension Service HO-203, table "Vegetables: frost resistance" (after University of Illinois VC 14a2, Vegetable Planting Guide); second-hand copy',
    evidence: 'published',
    // Read through the search tool on a personal blog that reprints the table and links
    // https://www.extension.purdue.edu/extmedia/ho/ho-203.html; the Purdue page itself was not stored.
    url: 'https://nancysgardenjournal.blogspot.com/p/frost-resistance.html',
  },
  {
    id: 'pmc3602570-table4',
    title:
      'Article doi:10.1007/s13197-011-0311-6, vol. 50(3):429–442, Table 4: The critical relative humidity and temperatures for various fruits and vegetables (the column recommended after the ASHRAE Handbook 1998)',
    evidence: 'published',
    // Read through the search tool on PubMed Central.
    url: 'https://pmc.ncbi.nlm.nih.gov/articles/PMC3602570/table/Tab4',
  },
  {
    id: 'wvu-rotation',
    title:
      'West Virginia University Extension, Crop rotation in the garden (2025), families as named by the Angiosperm Phylogeny Group; with UC Master Gardeners, Sacramento, after the UC Vegetable Research & Information Center',
    evidence: 'published',
  },
  {
    id: 'ncstate-rotation',
    title: 'NC State Extension, Surry County Center (2021), crop rotation advice ("4 years best")',
    evidence: 'published',
  },
  {
    id: 'uconn-disease-rotation',
    title: 'UConn Integrated Pest Management, Rotation periods suggested to help control vegetable diseases',
    evidence: 'published',
  },
  {
    id: 'clubroot-liming',
    title:
      'UC Cooperative Extension; Oregon State University; Pacific Northwest Plant Disease Management Handbook: clubroot of crucifers, liming and spore survival',
    evidence: 'published',
  },
  {
    id: 'cornell-early-blight-rotation',
    title: 'Cornell / Penn State, Do rotations matter within disease management programs? (tomato early blight)',
    evidence: 'published',
  },
  {
    id: 'extension-tomato-potato',
    title:
      'Extension vegetable pest guides on late blight and Verticillium wilt shared by tomato and potato (as gathered in the team source list; no single guide stored)',
    evidence: 'published',
  },
  {
    id: 'ufifas-eny056',
    title: 'UF/IFAS Extension ENY-056, Nematode management in the vegetable garden (marigolds as a cover crop)',
    evidence: 'published',
  },
  {
    id: 'uconn-trap-crop',
    title: 'UConn Integrated Pest Management, perimeter trap cropping of squash against cucumber beetle and squash vine borer',
    evidence: 'published',
  },
  {
    id: 'agronomy-2016-basil',
    title: 'Agronomy 6(3):42 (2016), basil intercropped with tomato under nets, whitefly field trial',
    evidence: 'published',
  },
  {
    id: 'chalker-scott-wsu',
    title:
      'Linda Chalker-Scott, Washington State University Puyallup Research and Extension Center, The myth of companion plantings',
    evidence: 'published',
    // Read through the search tool (docslib.org copy); this address is the one the Nevada
    // Appeal column of 7 April 2024 quotes for the WSU original.
    url: 'https://s3.wp.wsu.edu/uploads/sites/403/2015/03/companion-plantings.pdf',
  },
  // Botanical names, each read through the search tool on the page given.
  {
    id: 'wisc-a3688-vine-crops',
    title:
      'Wisconsin Extension publication A3688, Growing pumpkins and other vine crops in Wisconsin: a guide for fresh-market growers (K. A. Delahaut, A. C. Newenhouse), Plant description; copy on abcdocz',
    evidence: 'published',
    url: 'https://abcdocz.com/doc/160777/growing-pumpkins-and-other-vine-crops-in-wisconsin',
  },
  {
    id: 'vt-seed-production-solanaceae',
    title: 'Virginia Tech, Vegetable Seed Production (G. Welbaum), Family: Solanaceae',
    evidence: 'published',
    url: 'https://welbaum.spes.vt.edu/seedproduction/Solanacea.html',
  },
  {
    id: 'se-vegetable-handbook-2021',
    title:
      '2021 Vegetable Crop Handbook for Southeastern United States (Southeastern Vegetable Extension Workers), table of radish, rutabaga and turnip varieties, page 101',
    evidence: 'published',
    url: 'https://www.nxtbook.com/greatamericanmediaservices/GAMS/southeast-veg-crop-handbook-2021/index.php?startid=101',
  },
  {
    id: 'ufifas-plant-id-parsnip',
    title: 'UF/IFAS Gardening Solutions, Plant Identification Learning Module: Parsnip (Pastinaca sativa)',
    evidence: 'published',
    url: 'http://gardeningsolutions.ifas.ufl.edu/mastergardener/outreach/plant_id/vegetables/parsnip.shtml',
  },
  {
    id: 'unl-extension-eggplant-1982',
    title: 'University of Nebraska–Lincoln Extension (1982), eggplant growing guide; abstract read in the UNL Digital Commons record',
    evidence: 'published',
    url: 'http://digitalcommons.unl.edu/extensionhist/1013',
  },
  {
    id: 'umd-container-size',
    title:
      'University of Maryland Extension, Types of containers for growing vegetables: Choose the right container size (updated 20 February 2023)',
    evidence: 'published',
    // Read through the search tool. It prints a least depth of growing media for three groups of
    // crops (large 12-16 in, medium 8-12 in, small 4-6 in) and no raised bed depths.
    url: 'https://extension.umd.edu/resource/types-containers-growing-vegetables',
  },
  {
    id: 'common-practice',
    title: 'Common practice among gardeners and extension services; no single published source found',
    evidence: 'common_practice',
  },
  {
    id: 'from-memory',
    title: 'From memory; not confirmed in a stored copy of any source',
    evidence: 'from_memory',
  },
];

const byId = new Map(cropSources.map((s) => [s.id, s]));

/** The source with this id, or undefined when no such source is listed. */
export function cropSourceById(id: string): CropSource | undefined {
  return byId.get(id);
}
