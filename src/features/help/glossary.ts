import { CONDITION_BANDS } from '@shared/condition';

// The glossary, in Wearcourse's own words. `short` is the one line a tooltip
// shows; `more` adds what an engineer or a council member needs next. Where a
// figure comes from a standard, the standard is named.
export type GlossaryEntry = { id: string; term: string; aka?: string; short: string; more?: string };

const bands = CONDITION_BANDS.map((b) => `${b.label} ${b.min}–${b.max}`).join(', ');

export const GLOSSARY: GlossaryEntry[] = [
  {
    id: 'pci',
    term: 'PCI',
    aka: 'Pavement Condition Index',
    short: 'A 0–100 score of a pavement surface from a walked or driven survey of its distresses; 100 is new.',
    more: 'Inspectors record each kind of distress (cracking, rutting, patching, potholes…), its severity and extent, and the score follows the deduct method of ASTM D6433. It describes the surface today, not the strength of the layers below.',
  },
  {
    id: 'condition-band',
    term: 'Condition band',
    short: `Wearcourse's five PCI groups for reports and maps: ${bands}.`,
    more: 'They merge the seven ratings of ASTM D6433 (Good, Satisfactory, Fair, Poor, Very Poor, Serious, Failed) into five that read well before a council. A road is placed by its rounded PCI.',
  },
  {
    id: 'survey',
    term: 'Condition survey',
    short: 'One rating of a segment on one date, giving its PCI then.',
    more: 'A segment keeps every survey; its latest PCI is the one from the newest survey. Forecast curves are fitted to all of them.',
  },
  {
    id: 'segment',
    term: 'Segment',
    short: 'A stretch of one road between two points (usually intersections), managed as one unit.',
  },
  {
    id: 'lane-mile',
    term: 'Lane-mile',
    short: 'One mile of one traffic lane: a two-lane road one mile long is two lane-miles.',
    more: 'Work, cost and condition are often reported per lane-mile because paving quantities follow the lanes, not the length of road.',
  },
  {
    id: 'centreline-mile',
    term: 'Centreline mile',
    aka: 'centerline mile',
    short: 'One mile of road measured along its centre, whatever the number of lanes.',
  },
  {
    id: 'sy',
    term: 'SY',
    aka: 'square yard',
    short: 'Square yards of pavement (length × width ÷ 9 ft²); surface treatments are priced per SY.',
  },
  {
    id: 'adt',
    term: 'ADT',
    aka: 'average daily traffic',
    short: 'Vehicles a day on the segment, both directions together, averaged over the year.',
  },
  {
    id: 'esal',
    term: 'ESAL',
    aka: 'equivalent single axle load',
    short: 'Traffic expressed as passes of one 18,000-lb single axle that would do the same damage to the pavement.',
    more: 'The AASHTO 1993 design guide sizes pavements for the ESALs expected over their life. Heavy trucks count for far more than cars: damage grows roughly with the fourth power of axle load.',
  },
  {
    id: 'sn',
    term: 'SN',
    aka: 'structural number',
    short:
      'An index of how much load a pavement can carry: each layer’s thickness in inches × its layer coefficient, added up.',
    more: 'From the AASHTO 1993 guide. A thin overlay adds little: 1.5 in of new asphalt at the guide’s typical coefficient of 0.44 adds about 0.66. That is why a thin lift on a weak base is a caution, not a fix.',
  },
  {
    id: 'preservation',
    term: 'Preservation',
    short:
      'Low-cost work on a road still in good or fair condition (crack seal, chip seal, micro-surfacing) that slows its decline.',
  },
  {
    id: 'rehabilitation',
    term: 'Rehabilitation',
    short: 'Work that restores a worn surface without rebuilding the road: overlays, mill and overlay.',
  },
  {
    id: 'reconstruction',
    term: 'Reconstruction',
    short: 'Removing and rebuilding the pavement and usually its base: the most expensive treatment, for failed roads.',
  },
  {
    id: 'overlay',
    term: 'Overlay',
    short: 'A new layer (lift) of asphalt mix placed on the old surface; "mill and overlay" first grinds off the top.',
  },
  {
    id: 'lift',
    term: 'Lift',
    short: 'One layer of asphalt mix as placed and compacted, given by its thickness in inches.',
  },
  {
    id: 'spread-rate',
    term: 'Spread rate',
    short:
      'Pounds of mix per square yard per inch of thickness; with the area and the lift it gives the tons to order.',
  },
  {
    id: 'binder-grade',
    term: 'Binder grade',
    short:
      'The asphalt binder’s performance grade, e.g. PG 64-22: it performs between 64 °C pavement heat and −22 °C cold.',
  },
  {
    id: 'present-value',
    term: 'Present value',
    aka: 'PV',
    short:
      'What all of an alternative’s future costs are worth today: each year’s cost divided by (1 + discount rate) to the power of its year.',
    more: 'Adding costs at today’s value is what lets a cheap treatment repeated often be compared fairly with an expensive one done once.',
  },
  {
    id: 'discount-rate',
    term: 'Discount rate',
    short: 'The yearly rate, net of inflation, used to bring future costs back to today’s dollars.',
    more: 'FHWA’s life-cycle cost guidance (FHWA-SA-98-079) recommends a real rate; agencies often take the one the U.S. Office of Management and Budget publishes each year. A higher rate favours putting costs off.',
  },
  {
    id: 'euac',
    term: 'EUAC',
    aka: 'equivalent uniform annual cost',
    short: 'The present value turned into one equal cost per year over the analysis period.',
    more: 'EUAC = present value × i(1+i)ⁿ / ((1+i)ⁿ − 1), the capital recovery factor found in any engineering-economy table. It ranks alternatives exactly as present value does over the same period, and reads as "what this road costs us a year".',
  },
  {
    id: 'analysis-period',
    term: 'Analysis period',
    short: 'The years over which alternatives are costed; long enough that each includes at least one rehabilitation.',
  },
  {
    id: 'remaining-service-life',
    term: 'Remaining service life',
    aka: 'RSL',
    short: 'The years a pavement has left before it falls to the condition at which it needs rehabilitation.',
    more: 'At the end of the analysis period an alternative may still have life left; its remaining life value is credited so that a treatment placed just before the end is not counted as wasted.',
  },
  {
    id: 'remaining-life-value',
    term: 'Remaining life value',
    aka: 'salvage value',
    short:
      'The share of a treatment’s cost still "unused" at the end of the analysis period, credited back to the alternative.',
  },
  {
    id: 'sensitivity',
    term: 'Sensitivity (tornado)',
    short:
      'How far the answer moves when one input (a price, a life, the discount rate) is set low or high, one at a time.',
  },
  {
    id: 'break-even-rate',
    term: 'Break-even discount rate',
    short: 'The discount rate at which two alternatives cost the same; on either side of it a different one wins.',
  },
  {
    id: 'monte-carlo',
    term: 'Monte Carlo',
    short:
      'Running the comparison many times with inputs drawn from their ranges, to see how often each alternative is cheapest.',
  },
  {
    id: 'backlog',
    term: 'Backlog',
    short: 'The cost of the work that roads below the "needs work" PCI still need in a year and are not getting.',
    more: 'Each untreated road below that PCI counts at the cheapest treatment that fits it that year. A falling backlog means the budget keeps up with the network.',
  },
  {
    id: 'work-list',
    term: 'Work list',
    short: 'The plan’s answer: which segment gets which treatment in which year, with its quantities and cost.',
  },
  {
    id: 'scenario',
    term: 'Scenario',
    short: 'One set of plan inputs (years, budgets, rules, method) and the results of running it.',
  },
  {
    id: 'deterioration-curve',
    term: 'Deterioration curve',
    short: 'How PCI falls with age for one family of pavements: PCI = P0 − a·ageᵇ, fitted to the agency’s own surveys.',
  },
];

export const glossaryEntry = (id: string) => GLOSSARY.find((g) => g.id === id);
