/**
 * Short explanations of the terms the workspace shows, each with the published source it follows.
 * Flag rules are Driftcase's own (docs/flags.md gives the thresholds); the estimation terms are
 * the textbook ones.
 */
export interface GlossaryEntry {
  id: string;
  term: string;
  text: string;
  source: string;
}

const FLAG_SOURCE =
  'Driftcase flag rules, docs/flags.md (thresholds are engineering choices, not a standard)';

export const GLOSSARY: readonly GlossaryEntry[] = [
  {
    id: 'ess',
    term: 'Effective sample size (ESS)',
    text: 'How many particles really carry the belief: 1 / Σ wᵢ² for normalised weights. Equal weights give ESS = N; one particle holding all the weight gives ESS = 1. A low ESS means the filter is relying on very few hypotheses; resampling runs when ESS falls below the threshold × N.',
    source:
      'Kong, Liu & Wong (1994), J. Am. Statistical Assoc. 89(425); Doucet, de Freitas & Gordon (2001), Sequential Monte Carlo Methods in Practice, ch. 1',
  },
  {
    id: 'nees',
    term: 'Normalised estimation error squared (NEES)',
    text: "The onboard estimate's error weighed by its own covariance, eᵀ P⁻¹ e. If the robot's stated uncertainty is honest, NEES follows a chi-square distribution with 3 degrees of freedom (x, y, heading); above the 95 % bound (7.815) the robot was more confident than it should have been.",
    source:
      'Bar-Shalom, Li & Kirubarajan (2001), Estimation with Applications to Tracking and Navigation, §5.4',
  },
  {
    id: 'loglik',
    term: 'Log-likelihood per measurement',
    text: 'How well the scans and landmark detections fit the map at the believed pose, in nats, divided by the number of measurements used so that steps with more beams compare fairly. A sudden drop means the sensor evidence stopped agreeing with the map.',
    source:
      'Thrun, Burgard & Fox (2005), Probabilistic Robotics, §6.4 (likelihood field) and §4.3 (importance weights)',
  },
  {
    id: 'multinomial',
    term: 'Multinomial resampling',
    text: 'Draws N particles independently, each with probability equal to its weight. Simple, with the most added randomness.',
    source: 'Douc & Cappé (2005), "Comparison of resampling schemes for particle filtering", ISPA 2005',
  },
  {
    id: 'stratified',
    term: 'Stratified resampling',
    text: 'Splits [0, 1) into N equal strata and draws one uniform number in each; less random than multinomial.',
    source: 'Kitagawa (1996), J. Computational and Graphical Statistics 5(1); Douc & Cappé (2005)',
  },
  {
    id: 'systematic',
    term: 'Systematic resampling',
    text: 'Like stratified, but one uniform number shifts an evenly spaced comb of N points; the lowest-variance choice in common use.',
    source:
      'Kitagawa (1996); Thrun, Burgard & Fox (2005), Probabilistic Robotics, Table 4.4 (low-variance sampler)',
  },
  {
    id: 'residual',
    term: 'Residual resampling',
    text: 'Keeps ⌊N wᵢ⌋ copies of each particle, then fills the remainder by drawing from the leftover weights.',
    source: 'Liu & Chen (1998), J. Am. Statistical Assoc. 93(443); Douc & Cappé (2005)',
  },
  {
    id: 'belief_collapsed',
    term: 'Flag: belief collapsed',
    text: 'ESS fell below 2 % of the particles on repeated steps: the belief rested on a handful of particles.',
    source: FLAG_SOURCE,
  },
  {
    id: 'sensor_evidence_dropped',
    term: 'Flag: sensor evidence dropped',
    text: 'The log-likelihood per measurement, or the number of measurements, fell well below its level of the previous 10 s.',
    source: FLAG_SOURCE,
  },
  {
    id: 'odometry_disagrees_with_scans',
    term: 'Flag: odometry disagrees with scans',
    text: 'The scans kept correcting the wheel odometry in one direction, or a scan match found a clearly better pose elsewhere.',
    source: FLAG_SOURCE,
  },
  {
    id: 'map_out_of_date',
    term: 'Flag: map out of date',
    text: 'While the pose was right, a steady share of scan endpoints landed on cells the map calls free: something has moved.',
    source: FLAG_SOURCE,
  },
  {
    id: 'onboard_departed_from_replay',
    term: 'Flag: onboard departed from replay',
    text: "What the robot believed at the time was more than 0.3 m from the replay's mean pose for at least a second.",
    source: FLAG_SOURCE,
  },
  {
    id: 'onboard_departed_from_reference',
    term: 'Flag: onboard departed from reference',
    text: "The robot's own estimate was more than 0.3 m from the independent reference trajectory for at least a second.",
    source: FLAG_SOURCE,
  },
  {
    id: 'replay_lost_reference',
    term: 'Flag: replay lost the reference',
    text: 'The replay itself stayed more than the divergence distance from the reference trajectory.',
    source: FLAG_SOURCE,
  },
  {
    id: 'belief_split',
    term: 'Flag: belief split',
    text: 'The particles formed two or more separate clusters: the filter held competing hypotheses of where the robot was.',
    source: FLAG_SOURCE,
  },
  {
    id: 'input_gap',
    term: 'Flag: input gap',
    text: 'Odometry or scan rows were missing for longer than three usual periods.',
    source: FLAG_SOURCE,
  },
  {
    id: 'odometry_jump',
    term: 'Flag: odometry jump',
    text: 'Two consecutive odometry poses were further apart than the robot could have driven.',
    source: FLAG_SOURCE,
  },
];

export const glossaryEntry = (id: string): GlossaryEntry | undefined => GLOSSARY.find((e) => e.id === id);
