/**
 * The demo proposals (invented titles, people's requests, targets and abstracts), one list per demo
 * cycle. Positions move with the cycle: a target's right ascension is given as hours from the right
 * ascension on the meridian at local midnight of the cycle's middle night, so every target is up at night
 * in its cycle whenever the demo is loaded; time windows are days after the cycle's first night.
 */
import { AMARA, INES, OSKAR, TOMASZ } from "./demo-people";
import {
  accept,
  binary,
  calibrator,
  type DemoProposal,
  decline,
  disk,
  entry,
  gaussian,
  inCycle,
  limbDarkened,
  ring,
  target,
  waitlist,
} from "./demo-proposal-parts";
import { REVIEW_PROPOSALS } from "./demo-proposals-review";

export type { DemoDecision, DemoProposal, DemoProposalTarget } from "./demo-proposal-parts";

const CURRENT = inCycle("current", { status: "accepted", pdf: true }, [
  entry(
    ["Dynamical masses of the Cinder Pair 2 system", TOMASZ, [INES], "Binary and multiple stars"],
    "Resolving the inner pair of Cinder Pair 2 at three epochs fixes its orbit and, with the radial velocities, the masses of both stars to two per cent.",
    ["H", { "extended-6": 12, "medium-4": 6 }],
    [
      target(
        "Cinder Pair 2",
        -1.5,
        -47.35,
        binary(6, 48, 0.7),
        { H: 3.8 },
        { calibrators: [calibrator("Cinder Cal B", 2.2, 0.45, 0.4)] },
      ),
    ],
    {
      submittedDaysBeforeDeadline: 10,
      quality: 1.4,
      decision: accept(
        { "extended-6": 12, "medium-4": 6 },
        1.3,
        "Granted in full. Please plan the three epochs at least three weeks apart.",
      ),
    },
  ),
  entry(
    ["Rotational flattening of Brasa Echo 14", TOMASZ, [], "Stellar surfaces and diameters"],
    "A fast rotator looks elongated. Baselines at many position angles measure the ratio of its polar and equatorial diameters.",
    ["H", { "extended-6": 10 }],
    [target("Brasa Echo 14", 0.8, -38.8, disk(1.6), { H: 2.2 })],
    {
      status: "scheduled",
      submittedDaysBeforeDeadline: 13,
      quality: 1.9,
      decision: accept({ "extended-6": 10 }, 1.8, ""),
    },
  ),
  entry(
    ["Pulsation-phase diameters of Cerro Pulso 6", INES, [], "Evolved stars and mass loss"],
    "Measuring the diameter of a pulsating giant at four phases gives its distance through the ratio of angular to linear pulsation.",
    ["K", { "medium-4": 8 }],
    [target("Cerro Pulso 6", 2.1, -35.6, disk(3.4), { K: 1.1, H: 1.6 })],
    {
      submittedDaysBeforeDeadline: 4,
      quality: 2.2,
      decision: accept({ "medium-4": 8 }, 2.1, "Observe the four phases in order."),
    },
  ),
  entry(
    ["Surface of the supergiant Ventisca Roja 1", OSKAR, [], "Stellar surfaces and diameters"],
    "Convection cells on a red supergiant are a few tenths of its radius across. Short and long baselines together map their contrast.",
    ["H", { "compact-3": 6, "extended-6": 8 }],
    [target("Ventisca Roja 1", -2.6, -26.4, limbDarkened(9.5, 0.5), { H: -1.2 })],
    {
      submittedDaysBeforeDeadline: 2,
      quality: 2.6,
      decision: accept(
        { "compact-3": 6, "extended-6": 5 },
        2.5,
        "The extended configuration is oversubscribed at this LST: 5 of the 8 h requested could be granted.",
      ),
    },
  ),
  entry(
    ["Asymmetries in the envelope of Mesa Drift 11", AMARA, [], "Evolved stars and mass loss"],
    "Mesa Drift 11 ejects dust in episodes. A Gaussian envelope fit and its closure phases will show whether the latest ejection is one-sided.",
    ["K", { "medium-4": 9 }],
    [target("Mesa Drift 11", 1.9, -29.7, gaussian(8), { K: 2.3 })],
    {
      status: "waitlisted",
      submittedDaysBeforeDeadline: 6,
      quality: 3.1,
      decision: waitlist(
        3,
        "First on the waiting list for medium-4: you will hear from the schedulers if time frees up.",
      ),
    },
  ),
  entry(
    ["The hot-dust core of Puna Lantern 8", INES, [TOMASZ], "Active galactic nuclei"],
    "We ask for the longest baselines to resolve the hot dust around the nucleus of the galaxy Puna Lantern 8, expected at about a milliarcsecond.",
    ["K", { "extended-6": 30 }],
    [target("Puna Lantern 8", -0.4, -43.02, gaussian(0.8), { K: 9.6 })],
    {
      status: "declined",
      submittedDaysBeforeDeadline: 8,
      quality: 4.3,
      decision: decline(
        4.2,
        "The nucleus is fainter than the K-band limit of the combiner; the committee could not see how to fringe-track on it.",
      ),
    },
  ),
]);

const OPEN = inCycle("open", { status: "draft", pdf: false }, [
  entry(
    ["Limb darkening along the giant branch", INES, [TOMASZ], "Stellar surfaces and diameters"],
    "We will measure the strength of limb darkening of two red giants of different effective temperature, to test model atmospheres where they disagree most: in the second lobe of the visibility.",
    ["H", { "medium-4": 12 }],
    [
      target("Lumbre Nova 12", -1.2, -41.37, limbDarkened(4.2, 0.45), { H: 1.9, K: 1.7 }),
      target("Cerro Ardiente 7", 0.4, -28.05, limbDarkened(3.1, 0.38), { H: 2.6, K: 2.4 }),
    ],
  ),
  entry(
    [
      "Periastron passage of Quebrada Twin 9",
      TOMASZ,
      ["lucia.ferreyra@quebrada-obs.example"],
      "Binary and multiple stars",
    ],
    "",
    ["K", { "extended-6": 8 }],
    [
      target(
        "Quebrada Twin 9",
        1.1,
        -42.9,
        binary(3.5, 112, 0.55),
        { K: 4.1 },
        { timeWindows: [{ startDay: 61, endDay: 65, note: "periastron ± 2 days" }] },
      ),
    ],
  ),
  entry(
    ["A dust ring around Altiplano Halo 5", AMARA, [], "Circumstellar environments"],
    "The mid-infrared excess of Altiplano Halo 5 suggests a ring of warm dust a few astronomical units across. Short baselines at 10 µm can tell a ring from a uniform envelope.",
    ["N", { "compact-3": 10 }],
    [target("Altiplano Halo 5", 2.4, -34.2, ring(25), { N: 0.8 })],
    { instrument: "Ascua" },
  ),
  entry(
    ["Starspots of the young Sol Naciente 2", OSKAR, [], "Young stellar objects and discs"],
    "A young, active star rotates in under three days. Closure phases on consecutive nights follow its spots around.",
    ["H", { "extended-6": 10 }],
    [target("Sol Naciente 2", -0.7, -38.9, disk(0.9), { H: 5.6 })],
    { status: "submitted", pdf: true, submittedDaysBeforeDeadline: 20 },
  ),
]);

/** Every demo proposal: the decided cycle's, the cycle under review's, the open cycle's. */
export const DEMO_PROPOSALS: DemoProposal[] = [...CURRENT, ...REVIEW_PROPOSALS, ...OPEN];
