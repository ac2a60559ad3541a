/** E-mail addresses of the demo people who write most demo proposals (DEMO_PEOPLE in scenario.ts has them all). */
export const INES = "ines.arroyo@valle-alto.example";
export const TOMASZ = "tomasz.wierzbicki@baltic-stellar.example";
export const AMARA = "amara.okafor@harmattan-obs.example";
export const OSKAR = "oskar.lindfors@saltmarsh.example";
