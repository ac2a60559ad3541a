/**
 * The 88 constellations: IAU three-letter abbreviation, Latin name and Latin genitive (the form used in
 * designations such as "Alpha Orionis"). The list follows the IAU's table of constellation names and
 * abbreviations (IAU 1922, adopted at the first General Assembly; boundaries Delporte 1930), written here
 * from memory; a test checks that it has 88 distinct entries and that every constellation named in the
 * star data is among them.
 */

export interface Constellation {
  /** IAU abbreviation, e.g. "UMa". */
  abbr: string;
  /** Latin name, e.g. "Ursa Major". */
  name: string;
  /** Latin genitive, e.g. "Ursae Majoris". */
  genitive: string;
}

const TABLE = `And Andromeda Andromedae
Ant Antlia Antliae
Aps Apus Apodis
Aqr Aquarius Aquarii
Aql Aquila Aquilae
Ara Ara Arae
Ari Aries Arietis
Aur Auriga Aurigae
Boo Boötes Boötis
Cae Caelum Caeli
Cam Camelopardalis Camelopardalis
Cnc Cancer Cancri
CVn Canes_Venatici Canum_Venaticorum
CMa Canis_Major Canis_Majoris
CMi Canis_Minor Canis_Minoris
Cap Capricornus Capricorni
Car Carina Carinae
Cas Cassiopeia Cassiopeiae
Cen Centaurus Centauri
Cep Cepheus Cephei
Cet Cetus Ceti
Cha Chamaeleon Chamaeleontis
Cir Circinus Circini
Col Columba Columbae
Com Coma_Berenices Comae_Berenices
CrA Corona_Australis Coronae_Australis
CrB Corona_Borealis Coronae_Borealis
Crv Corvus Corvi
Crt Crater Crateris
Cru Crux Crucis
Cyg Cygnus Cygni
Del Delphinus Delphini
Dor Dorado Doradus
Dra Draco Draconis
Equ Equuleus Equulei
Eri Eridanus Eridani
For Fornax Fornacis
Gem Gemini Geminorum
Gru Grus Gruis
Her Hercules Herculis
Hor Horologium Horologii
Hya Hydra Hydrae
Hyi Hydrus Hydri
Ind Indus Indi
Lac Lacerta Lacertae
Leo Leo Leonis
LMi Leo_Minor Leonis_Minoris
Lep Lepus Leporis
Lib Libra Librae
Lup Lupus Lupi
Lyn Lynx Lyncis
Lyr Lyra Lyrae
Men Mensa Mensae
Mic Microscopium Microscopii
Mon Monoceros Monocerotis
Mus Musca Muscae
Nor Norma Normae
Oct Octans Octantis
Oph Ophiuchus Ophiuchi
Ori Orion Orionis
Pav Pavo Pavonis
Peg Pegasus Pegasi
Per Perseus Persei
Phe Phoenix Phoenicis
Pic Pictor Pictoris
Psc Pisces Piscium
PsA Piscis_Austrinus Piscis_Austrini
Pup Puppis Puppis
Pyx Pyxis Pyxidis
Ret Reticulum Reticuli
Sge Sagitta Sagittae
Sgr Sagittarius Sagittarii
Sco Scorpius Scorpii
Scl Sculptor Sculptoris
Sct Scutum Scuti
Ser Serpens Serpentis
Sex Sextans Sextantis
Tau Taurus Tauri
Tel Telescopium Telescopii
Tri Triangulum Trianguli
TrA Triangulum_Australe Trianguli_Australis
Tuc Tucana Tucanae
UMa Ursa_Major Ursae_Majoris
UMi Ursa_Minor Ursae_Minoris
Vel Vela Velorum
Vir Virgo Virginis
Vol Volans Volantis
Vul Vulpecula Vulpeculae`;

/** The 88 constellations in alphabetical order of abbreviation (as the IAU table lists them). */
export const CONSTELLATIONS: readonly Constellation[] = TABLE.split("\n").map((line) => {
  const [abbr, name, genitive] = line.split(" ");
  return { abbr, name: name.replace(/_/g, " "), genitive: genitive.replace(/_/g, " ") };
});

/** Abbreviation (any case) → constellation. */
const BY_ABBR = new Map(CONSTELLATIONS.map((c) => [c.abbr.toLowerCase(), c]));

/** The constellation of an abbreviation in any case ("ori", "ORI", "Ori"), or null. */
export function constellationByAbbr(abbr: string): Constellation | null {
  return BY_ABBR.get(abbr.toLowerCase()) ?? null;
}
