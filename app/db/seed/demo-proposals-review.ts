/**
 * The demo cycle under review: thirteen submitted proposals (and one withdrawn) that the committee is
 * reading, several with a reviewer on the team or from the same institute. Invented throughout.
 */
import { AMARA, INES, OSKAR, TOMASZ } from "./demo-people";
import { binary, calibrator, disk, entry, gaussian, inCycle, limbDarkened, ring, target } from "./demo-proposal-parts";

export const REVIEW_PROPOSALS = inCycle("review", { status: "under_review", pdf: true }, [
  entry(
    ["Diameters of cool dwarfs in the southern sky", INES, [AMARA], "Stellar surfaces and diameters"],
    "Radii of M dwarfs disagree with evolutionary models by several per cent. We will measure the angular diameters of three nearby cool dwarfs on the longest baselines and combine them with parallaxes.",
    ["H", { "extended-6": 16 }],
    [
      target(
        "Pampa Kite 3",
        -2.2,
        -45.6,
        disk(0.9),
        { H: 4.8 },
        { calibrators: [calibrator("Pampa Cal A", 1.9, 1.5, 0.25, 5.1)] },
      ),
      target("Ojo Lento 16", 0.1, -38.22, disk(1.2), { H: 5.3 }),
      target("Sierra Glint 30", 1.6, -42.3, disk(0.7), { H: 5.9 }, { minElevationDeg: 40 }),
    ],
    { submittedDaysBeforeDeadline: 12, quality: 1.8 },
  ),
  entry(
    [
      "Wind-blown envelope of Viento Ember 21",
      TOMASZ,
      [AMARA, "jonas.ekberg@saltmarsh.example"],
      "Evolved stars and mass loss",
    ],
    "The envelope of Viento Ember 21 changes shape between pulsation phases. Two configurations sample both its size and its departures from symmetry.",
    ["K", { "compact-3": 6, "medium-4": 10 }],
    [target("Viento Ember 21", 2.3, -24.81, gaussian(12), { K: 0.9, H: 1.4 })],
    { submittedDaysBeforeDeadline: 6, quality: 2.4 },
  ),
  entry(
    ["Inner disc rims of two young stars", AMARA, [INES], "Young stellar objects and discs"],
    "Near-infrared emission of young discs comes from their inner rims. We will measure the rim size of two stars of different luminosity to test the dust sublimation law.",
    ["K", { "medium-4": 14 }],
    [
      target("Nido Spark 19", 1.2, -24.4, gaussian(3.5), { K: 6.2 }),
      target("Cumbre Shell 6", -3.1, -64.9, ring(5), { K: 6.8 }),
    ],
    { submittedDaysBeforeDeadline: 3, quality: 2 },
  ),
  entry(
    ["Spotted surface of Salar Veil 44", INES, [], "Stellar surfaces and diameters"],
    "Closure phases on the extended configuration reveal asymmetric surfaces. We will look for a large cool spot on the active giant Salar Veil 44.",
    ["H", { "extended-6": 20 }],
    [target("Salar Veil 44", -0.6, -17.6, limbDarkened(2.4, 0.3), { H: 3.2 })],
    { submittedDaysBeforeDeadline: 20, quality: 2.9 },
  ),
  entry(
    ["Cold wind of Ventana Fria 27", AMARA, [TOMASZ], "Circumstellar environments"],
    "A slow, cold wind shows at 10 µm as an extended halo. We withdrew this request to combine it with a later one.",
    ["N", { "compact-3": 8 }],
    [target("Ventana Fria 27", -2.8, -58.1, gaussian(30), { N: 1.5 })],
    { status: "withdrawn", instrument: "Ascua", submittedDaysBeforeDeadline: 15 },
  ),
  entry(
    ["Mass loss of the carbon star Hollín 3", TOMASZ, [], "Evolved stars and mass loss"],
    "The dust shell of a carbon star grows between cycles; its size in K against H gives the condensation radius.",
    ["K", { "medium-4": 8 }],
    [target("Hollín 3", 0.9, -33.1, gaussian(6.5), { K: 1.8 })],
    { submittedDaysBeforeDeadline: 2, quality: 3.3 },
  ),
  entry(
    ["A close companion to Faro Azul 17", OSKAR, [], "Binary and multiple stars"],
    "Lunar-occultation hints of a companion at 4 mas. The extended configuration can confirm it and measure its flux ratio.",
    ["H", { "extended-6": 12 }],
    [target("Faro Azul 17", -1.4, -20.3, binary(4, 210, 0.2), { H: 4.4 })],
    { submittedDaysBeforeDeadline: 9, quality: 2.2 },
  ),
  entry(
    ["Limb-darkening law of Arena Clara 2", INES, [OSKAR], "Stellar surfaces and diameters"],
    "A bright dwarf measured in the second visibility lobe separates linear from power-law limb darkening.",
    ["H", { "medium-4": 10 }],
    [target("Arena Clara 2", 3, -41, limbDarkened(2.9, 0.35), { H: 1.5 })],
    { submittedDaysBeforeDeadline: 1, quality: 3.6 },
  ),
  entry(
    ["Dust shells of two Mira variables", AMARA, [], "Evolved stars and mass loss"],
    "Two Miras at opposite phases: their shells at 10 µm against their photospheres in K.",
    ["K", { "compact-3": 10, "medium-4": 6 }],
    [
      target("Niebla Larga 5", -0.2, -49.5, gaussian(14), { K: 0.2 }),
      target("Niebla Corta 8", 2.7, -30.8, gaussian(10), { K: 0.6 }),
    ],
    { submittedDaysBeforeDeadline: 5, quality: 3 },
  ),
  entry(
    ["Imaging the spots of Brasero 9", OSKAR, [INES], "Stellar surfaces and diameters"],
    "An image of a spotted giant needs many baselines and triangles: we ask for six nights on the extended configuration to reconstruct its surface.",
    ["H", { "extended-6": 24 }],
    [target("Brasero 9", 0.4, -44.2, limbDarkened(3.8, 0.4), { H: 2 })],
    { submittedDaysBeforeDeadline: 4, quality: 1.6 },
  ),
  entry(
    ["Orbit of the triple Tres Lomas 5", TOMASZ, [OSKAR], "Binary and multiple stars"],
    "The outer pair of a hierarchical triple at two epochs, the inner pair resolved on the longest baselines.",
    ["H", { "extended-6": 14, "medium-4": 4 }],
    [target("Tres Lomas 5", -1.9, -46.4, binary(8, 75, 0.45), { H: 3.9 })],
    { submittedDaysBeforeDeadline: 7, quality: 2.5 },
  ),
  entry(
    ["Gas disc of the Be star Alba Fria 22", INES, [], "Circumstellar environments"],
    "The decretion disc of a Be star is elongated; its extent in K across position angles gives its inclination.",
    ["K", { "medium-4": 12, "compact-3": 4 }],
    [target("Alba Fria 22", 1.7, -27.9, gaussian(2.8), { K: 3.7 })],
    { submittedDaysBeforeDeadline: 10, quality: 2.8 },
  ),
  entry(
    ["Angular diameters of hot subdwarfs", OSKAR, [], "Stellar surfaces and diameters"],
    "Two hot subdwarfs are at the edge of what the longest baselines resolve; even upper limits constrain their radii.",
    ["H", { "extended-6": 8 }],
    [target("Chispa Blanca 1", -3.3, -36.7, disk(0.35), { H: 6.9 })],
    { submittedDaysBeforeDeadline: 3, quality: 4.1 },
  ),
  entry(
    ["The ring of the young star Cuna Helada 13", AMARA, [OSKAR], "Young stellar objects and discs"],
    "A transition disc with a cleared cavity: short baselines at 10 µm see the ring, K band the inner rim.",
    ["N", { "compact-3": 8, "medium-4": 6 }],
    [target("Cuna Helada 13", 2, -52, ring(18), { N: 1.2 })],
    { instrument: "Ascua", submittedDaysBeforeDeadline: 8, quality: 2.6 },
  ),
]);
