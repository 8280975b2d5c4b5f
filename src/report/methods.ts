// The models a day report's figures rest on, each with the source the physics core cites beside its code.
import type { MethodNote } from './report-model';

export const METHOD_NOTES: readonly MethodNote[] = [
  {
    topic: 'Air density',
    text: 'Moist-air density from the station pressure, temperature and humidity by the CIPM-2007 equation (compressibility factor, molar mass of dry air, mole fraction of water vapour); stated for 600–1100 hPa and 15–27 °C, outside it a warning is shown. Dynamic viscosity by Sutherland\'s law.',
    source: 'A. Picard, R. S. Davis, M. Gläser, K. Fujii, "Revised formula for the density of moist air (CIPM-2007)", Metrologia 45 (2008) 149–155; U.S. Standard Atmosphere 1976 / ISO 2533 for viscosity.',
  },
  {
    topic: 'Gravity',
    text: 'Normal gravity on the WGS84 ellipsoid at the site\'s latitude (Somigliana\'s closed form) with the free-air gradient 0.3086 mGal/m for its elevation; terrain and local anomalies are not modelled (up to about 1e-4 relative), a measured value replaces the formula.',
    source: 'NIMA TR8350.2, Department of Defense World Geodetic System 1984, 3rd ed. (2000), chapter 4.',
  },
  {
    topic: 'Drag law and fall model',
    text: 'A body released from rest in still air with quadratic drag: (m + C_a·ρ·V)·dv/dt = (m − ρ·V)·g − ½·ρ·C_d·A·v², solved in closed form (v = v_t·tanh(t/τ), y = ln cosh(t/τ)/k). C_d is the least-squares value over the series\' drops, with an optional constant timing delay fitted with it. Predicted times for a sphere follow the standard sphere drag curve, with the curve\'s own standard uncertainty of C_d (5 % up to Re 1e5, 10 % at 2e5, 50 % in the drag crisis) carried to each time.',
    source: 'Closed form of the quadratic-drag fall (standard mechanics); R. Clift, J. R. Grace, M. E. Weber, Bubbles, Drops, and Particles (1978), Table 5.2, for the sphere curve; its uncertainty from the spread of Roos & Willmarth (1971), Morsi & Alexander (1972), Brown & Lawler (2003) and Hoerner (1965).',
  },
  {
    topic: 'Buoyancy and added mass',
    text: 'The displaced air lowers the driving weight to (m − ρ·V)·g; the air set moving adds C_a·ρ·V to the inertia, with C_a = 1/2 for a sphere and the equal-area spheroid\'s potential-flow value for cylinders, discs and boxes.',
    source: 'H. Lamb, Hydrodynamics, 6th ed. (1932), §§ 92, 102, 373; C. E. Brennen, "A review of added mass and fluid inertial forces" (1982).',
  },
  {
    topic: 'Uncertainty',
    text: 'A GUM budget of every input\'s contribution to u(C_d) (sensitivity times standard uncertainty, Type A scatter between drops with its degrees of freedom) and a Monte Carlo propagation of the full model, fit included, for the 95 % coverage interval.',
    source: 'JCGM 100:2008 (GUM) and JCGM 101:2008 (propagation of distributions by a Monte Carlo method).',
  },
];

export const REPORT_CAUTION =
  'Dropping objects from height can hurt people and damage property. Keep the landing zone closed while drops are made, and follow local rules and licensed practice for work at height; the figures here do not replace them.';
