/**
 * Caution texts the portal shows beside engine output that can hurt people or break rules.
 * The product supports decisions; the label, local codes and licensed practice decide.
 */
export const CAUTIONS = {
  feed:
    'Fertiliser rates here are planning estimates. The product label is the law: follow its rate, timing and storage directions, local rules (blackout dates, buffers near water, phosphorus limits) and use licensed applicators where required.',
  pesticide:
    'Pesticide work must follow the product label, local regulations and notification rules, by a licensed applicator where required. This product does not recommend pesticide products or rates.',
  mowing:
    'Mowing: check slopes before mowing (use equipment rated for the grade or hand mowing), clear debris, keep guards and discharge chutes in place, wear PPE and keep people clear of thrown objects.',
  hardness:
    'Surface hardness above the limit for the tester used raises the risk of head injury: consider closing the field until it is corrected. Readings from different testers are not comparable; the range for the 2.25 kg tester is a department setting, not a published standard.',
  wetField:
    'Wet or waterlogged fields tear and compact under play and footing is poor: close or restrict them until they drain.',
  // NOAA / National Weather Service lightning safety, "When thunder roars, go indoors" (from memory).
  lightning:
    'Lightning: clear the field at the first thunder and stay off until 30 minutes after the last thunder (NOAA / National Weather Service: “When thunder roars, go indoors”). Local rules and the sport’s governing body decide.',
  water:
    'Watering restrictions are local law: the allowed days, hours and volumes set by the water provider override this schedule.',
  /** Shown where a pesticide or fertiliser application is recorded (the 10 mph drift limit many labels set: from memory). */
  application:
    'The product label is the law: apply only at its rate, to its sites and in its weather limits. Pesticides by a licensed applicator where required; keep people off for the label\'s re-entry interval and post the notice local rules ask for; do not spray in wind that drifts (most labels: not above about 10 mph) or before rain the label warns of; keep buffers to water. Local codes and licensed practice decide.',
  // Turf colourants (dyes, pigments) only tint the leaf: common practice.
  colourant:
    'Colourant changes colour, not turf health: it hides no disease, drought or wear. Follow the label for rate, mixing, protective equipment and drying time, and keep spray off paths, seats and players\' kit.',
  lines:
    'Use turf-safe line paint at the label\'s dilution; dark pigments (reds, blues) can damage turf, so put a white base coat under colours.',
} as const;

export type CautionKey = keyof typeof CAUTIONS;
