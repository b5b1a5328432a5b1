import type { CropRelation, Sourced } from './types';

/**
 * Most companion-planting claims are folk practice with little trial evidence behind them;
 * only the few in sources.md section 5 are marked `research`. The product shows this caution
 * beside every relation that is not research-backed.
 */
export const companionCaution: Sourced<string> = {
  value:
    'Most companion-planting charts lack scientific support; treat a common-practice pairing as a gardeners’ habit worth trying, not a proven effect.',
  source: 'chalker-scott-wsu',
};

const SAME_PLOT = { kind: 'same_plot' } as const;
const near = (distanceM: number) => ({ kind: 'neighbours', distanceM }) as const;

function folk(a: string, b: string, effect: CropRelation['effect'], reason: string, scope: CropRelation['scope'] = SAME_PLOT): CropRelation {
  return {
    a,
    b,
    effect,
    scope,
    reason,
    evidence: 'common_practice',
    // A folk antagonism is only ever a watch: no source says the harm is real.
    ...(effect === 'antagonistic' ? { severity: 'watch' as const } : {}),
    source: 'common-practice',
  };
}

export const cropRelations: CropRelation[] = [
  // Research-backed (sources.md section 5).
  {
    a: 'tomato',
    b: 'potato',
    effect: 'antagonistic',
    scope: near(1.5),
    reason:
      'They share late blight and Verticillium wilt: one spreads blight to the other, and either leaves wilt in the soil. Keep them apart and do not follow one with the other.',
    evidence: 'research',
    severity: 'clash',
    source: 'extension-tomato-potato',
  },
  {
    a: 'french-marigold',
    b: 'tomato',
    effect: 'beneficial',
    scope: SAME_PLOT,
    reason:
      'French marigold grown densely as a crop before tomato, in warm soil, suppresses root-knot nematodes; a few plants dotted between tomatoes do much less.',
    evidence: 'research',
    source: 'ufifas-eny056',
  },
  {
    a: 'french-marigold',
    b: 'carrot',
    effect: 'beneficial',
    scope: SAME_PLOT,
    reason:
      'French marigold grown densely before the crop suppresses root-knot nematodes, which fork and gall carrots; interplanting helps much less.',
    evidence: 'research',
    source: 'ufifas-eny056',
  },
  {
    a: 'winter-squash',
    b: 'zucchini',
    effect: 'beneficial',
    scope: SAME_PLOT,
    reason:
      'A border of squash as a trap crop drew cucumber beetles and squash vine borers away from the main planting in Connecticut trials; the border itself may need treating.',
    evidence: 'research',
    source: 'uconn-trap-crop',
  },
  {
    a: 'basil',
    b: 'tomato',
    effect: 'beneficial',
    scope: SAME_PLOT,
    reason:
      'Rows of basil among tomatoes under nets reduced whitefly in one field trial. The common claim that basil improves tomato flavour is folk practice.',
    evidence: 'research',
    source: 'agronomy-2016-basil',
  },

  // Folk practice (the large majority).
  folk('bush-bean', 'onion', 'antagonistic', 'Folk practice holds that onions stunt beans; there is little trial evidence.'),
  folk('bush-bean', 'garlic', 'antagonistic', 'Folk practice holds that garlic stunts beans; there is little trial evidence.'),
  folk('bush-bean', 'leek', 'antagonistic', 'Folk practice keeps the onion family away from beans; there is little trial evidence.'),
  folk('bush-bean', 'chives', 'antagonistic', 'Folk practice keeps the onion family away from beans; there is little trial evidence.'),
  folk('pea', 'onion', 'antagonistic', 'Folk practice holds that onions stunt peas; there is little trial evidence.'),
  folk('pea', 'garlic', 'antagonistic', 'Folk practice holds that garlic stunts peas; there is little trial evidence.'),
  folk('pea', 'leek', 'antagonistic', 'Folk practice keeps the onion family away from peas; there is little trial evidence.'),
  folk('pea', 'chives', 'antagonistic', 'Folk practice keeps the onion family away from peas; there is little trial evidence.'),
  folk('carrot', 'onion', 'beneficial', 'The strong smell of onions is said to mask carrots from carrot fly, and carrots onions from onion fly.'),
  folk('carrot', 'leek', 'beneficial', 'Leeks are said to mask carrots from carrot fly, as onions are.'),
  folk('carrot', 'chives', 'beneficial', 'Chives are said to mask carrots from carrot fly.'),
  folk('carrot', 'radish', 'beneficial', 'Quick radishes sown with slow carrots mark the row and loosen the surface; they are pulled before the carrots need the room.'),
  folk('parsnip', 'radish', 'beneficial', 'Quick radishes mark the slow parsnip row and are pulled before the parsnips need the room.'),
  folk('lettuce', 'radish', 'beneficial', 'Both are quick and shallow; radishes fill gaps between young lettuces and are gone before the lettuces spread.'),
  folk('spinach', 'radish', 'beneficial', 'Radish sown with spinach is said to draw leaf miners away from it.'),
  folk('pea', 'radish', 'beneficial', 'Radishes sown along a pea row come up fast, mark the row and are pulled before the peas need the room.'),
  folk('bush-bean', 'radish', 'beneficial', 'Radishes between young beans use the space early and are gone before the beans close over.'),
  folk('winter-squash', 'radish', 'beneficial', 'Radishes sown round squash are said to draw flea beetles and cucumber beetles away; they are pulled before the vines spread.'),
  folk('zucchini', 'radish', 'beneficial', 'Radishes sown round squash plants are said to draw beetles away and are pulled before the leaves spread.'),
  // "Beside" read as the next row or the plot across a narrow path: 1 m is our own reading (common practice gives no distance).
  folk('potato', 'radish', 'antagonistic', 'Folk practice keeps radishes away from potatoes, saying each checks the other; there is little trial evidence.', near(1)),
  folk('lettuce', 'carrot', 'beneficial', 'Shallow lettuce and deep carrot use different soil layers, so they share a bed well.'),
  folk('lettuce', 'chives', 'beneficial', 'Chives are said to keep aphids off lettuce.'),
  folk('sweet-corn', 'bush-bean', 'beneficial', 'Part of the corn, beans and squash mix: beans fix nitrogen and corn gives shelter.'),
  folk('sweet-corn', 'winter-squash', 'beneficial', 'Part of the corn, beans and squash mix: squash leaves shade the soil and keep weeds down.'),
  folk('sweet-corn', 'tomato', 'antagonistic', 'Corn earworm is the same insect as tomato fruitworm; growing both close together is said to build it up.', near(1.5)),
  folk('cabbage', 'dill', 'beneficial', 'Dill flowers draw small parasitic wasps and hoverflies that attack cabbage caterpillars and aphids.'),
  folk('broccoli', 'dill', 'beneficial', 'Dill flowers draw small parasitic wasps and hoverflies that attack caterpillars and aphids.'),
  folk('cabbage', 'nasturtium', 'beneficial', 'Nasturtium is grown as a sacrificial plant that draws aphids and cabbage caterpillars away.'),
  folk('kale', 'nasturtium', 'beneficial', 'Nasturtium is grown as a sacrificial plant that draws aphids away from kale.'),
  folk('broccoli', 'nasturtium', 'beneficial', 'Nasturtium is grown as a sacrificial plant that draws aphids away from broccoli.'),
  folk('cucumber', 'nasturtium', 'beneficial', 'Nasturtium is said to deter cucumber beetles.'),
  folk('zucchini', 'nasturtium', 'beneficial', 'Nasturtium is said to deter squash bugs and cucumber beetles.'),
  folk('cucumber', 'dill', 'beneficial', 'Dill flowers draw insects that prey on cucumber pests.'),
  folk('cucumber', 'sunflower', 'beneficial', 'Sunflowers give light shelter and a support for cucumber vines.'),
  folk('sunflower', 'potato', 'antagonistic', 'Sunflowers are said to check the growth of potatoes near them.', near(1.5)),
  folk('cucumber', 'potato', 'antagonistic', 'Folk practice keeps cucumbers away from potatoes, saying they invite blight; there is little trial evidence.'),
  folk('tomato', 'carrot', 'beneficial', 'Carrots grown round tomatoes use the soil between them; the pairing is a popular one with little trial evidence.'),
  folk('tomato', 'parsley', 'beneficial', 'Parsley left to flower draws hoverflies whose larvae eat aphids.'),
  folk('tomato', 'cabbage', 'antagonistic', 'Folk practice says tomatoes and cabbages stunt each other; there is little trial evidence.'),
  folk('tomato', 'dill', 'antagonistic', 'Folk practice says mature dill stunts tomatoes; young dill is said to be fine.'),
  folk('carrot', 'dill', 'antagonistic', 'Dill and carrot are in the same family and share carrot fly; dill is also said to stunt carrots.'),
  folk('beet', 'onion', 'beneficial', 'A common pairing in mixed rows; onions are said to keep pests off beet.'),
  folk('beet', 'lettuce', 'beneficial', 'Both fit between each other in a mixed row without competing much.'),
  folk('cabbage', 'onion', 'beneficial', 'Onions are said to confuse pests looking for cabbage.'),
  folk('broccoli', 'lettuce', 'beneficial', 'Lettuce fills the space between young broccoli plants and is cut before they spread.'),
  folk('eggplant', 'bush-bean', 'beneficial', 'Bush beans are said to keep Colorado potato beetles off eggplant.'),
  folk('potato', 'bush-bean', 'beneficial', 'Bush beans are said to keep Colorado potato beetles off potatoes.'),
  folk('eggplant', 'potato', 'antagonistic', 'They share Verticillium wilt and Colorado potato beetle; planted close they feed each other’s troubles.', near(1.5)),
  folk('sweet-pepper', 'basil', 'beneficial', 'Basil is said to keep aphids and thrips off peppers.'),
  folk('tomato', 'garlic', 'beneficial', 'Garlic is said to keep spider mites and aphids off tomatoes.'),
  folk('sweet-pepper', 'french-marigold', 'beneficial', 'Marigold flowers draw hoverflies that eat aphids.'),
  folk('pea', 'turnip', 'beneficial', 'Peas and turnips are an old pairing for cool-season rows.'),
  folk('pea', 'carrot', 'beneficial', 'A traditional pairing in mixed rows.'),
  folk('coriander', 'spinach', 'beneficial', 'Coriander flowers draw hoverflies and small wasps that eat aphids.'),
];
