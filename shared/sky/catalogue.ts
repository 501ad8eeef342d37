/**
 * Gnomon's target catalogue: the galactic centre plus deep-sky objects that wide-field and
 * landscape photographers shoot (bright nebulae, large clusters, galaxies, dark nebulae).
 *
 * DATA SOURCE AND LICENCE
 * Positions (J2000), sizes (major/minor axis, arcmin), types and the OpenNGC common names are taken
 * unchanged from OpenNGC by Mattia Verga, https://github.com/mattiaverga/OpenNGC :
 *   database_files/NGC.csv      (commit 74e909e8f68af88f26d56860a3ca3ecec2e3007d)
 *   database_files/addendum.csv (commit 6248871af1fb196289c19ee731e71a511f6b324a)
 * OpenNGC is licensed under the Creative Commons Attribution-ShareAlike 4.0 International licence
 * (CC-BY-SA-4.0, https://creativecommons.org/licenses/by-sa/4.0/). The data table below is a
 * selection of OpenNGC rows and is shared under the same licence, CC-BY-SA-4.0.
 * Each entry keeps the OpenNGC row name it came from (`openNgcRow`).
 *
 * Names: `name` is OpenNGC's common name when it has one (nameSource 'OpenNGC'); for a few famous
 * objects that OpenNGC lists without a name, Gnomon adds the name photographers use
 * (nameSource 'common usage'); otherwise the designation is the name. One OpenNGC name is left
 * out on purpose: OpenNGC calls IC 434 "Flame Nebula", but photographers' Flame Nebula is NGC 2024.
 * The galactic centre is not an OpenNGC object: it is l = 0, b = 0 of the IAU galactic frame
 * (see galactic.ts).
 */
import type { EquatorialJ2000 } from '../schemas/geometry';
import { GALACTIC_CENTRE_J2000 } from './galactic';

/** Broad kinds of targets. */
export type TargetType =
  | 'galactic-centre'
  | 'galaxy'
  | 'globular-cluster'
  | 'open-cluster'
  | 'star-association'
  | 'cluster-with-nebula'
  | 'emission-nebula'
  | 'reflection-nebula'
  | 'nebula'
  | 'dark-nebula'
  | 'supernova-remnant'
  | 'planetary-nebula';

/** OpenNGC object type codes used in this catalogue. */
type OpenNgcType = 'G' | 'GCl' | 'OCl' | '*Ass' | 'Cl+N' | 'HII' | 'RfN' | 'Neb' | 'DrkN' | 'SNR' | 'PN';

const TYPE_OF: Record<OpenNgcType, TargetType> = {
  G: 'galaxy',
  GCl: 'globular-cluster',
  OCl: 'open-cluster',
  '*Ass': 'star-association',
  'Cl+N': 'cluster-with-nebula',
  HII: 'emission-nebula',
  RfN: 'reflection-nebula',
  Neb: 'nebula',
  DrkN: 'dark-nebula',
  SNR: 'supernova-remnant',
  PN: 'planetary-nebula',
};

/** A catalogue target. */
export interface Target extends EquatorialJ2000 {
  /** Lower-case designation used as the id, e.g. 'm42', 'ngc7000', 'ic434', 'galactic-centre'. */
  id: string;
  /** Display name. */
  name: string;
  /** Where `name` comes from. */
  nameSource: 'OpenNGC' | 'common usage' | 'designation' | 'IAU galactic frame';
  /** Catalogue designations, e.g. ['M 42', 'NGC 1976', 'LBN 974']. */
  designations: string[];
  /** Other names it is searched by. */
  aliases: string[];
  type: TargetType;
  /** OpenNGC type code, when the target comes from OpenNGC. */
  openNgcType?: string;
  /** Apparent size, arcmin (OpenNGC major/minor axis; minor = major when OpenNGC gives one axis); null when unknown. */
  sizeArcmin: { major: number; minor: number } | null;
  /** IAU constellation abbreviation. */
  constellation: string;
  /** OpenNGC source file and row name, e.g. 'NGC.csv NGC1976'. */
  openNgcRow?: string;
  /** Caveat about the position or identity, when there is one. */
  note?: string;
}

interface Row {
  id: string;
  file: 'NGC.csv' | 'addendum.csv';
  row: string;
  type: OpenNgcType;
  ra: string;
  dec: string;
  constellation: string;
  major: number | null;
  minor: number | null;
  designations: string[];
  name?: string;
  nameSource?: 'OpenNGC' | 'common usage';
  aliases?: string[];
  note?: string;
}

// prettier-ignore
const ROWS: Row[] = [
  // --- Orion, Taurus, Auriga, Gemini, Monoceros (winter sky of the north) ---
  { id: 'm42', file: 'NGC.csv', row: 'NGC1976', type: 'Cl+N', ra: '05:35:16.48', dec: '-05:23:22.8', constellation: 'Ori', major: 90, minor: 60, designations: ['M 42', 'NGC 1976', 'LBN 974'], name: 'Orion Nebula', nameSource: 'OpenNGC', aliases: ['Great Orion Nebula'] },
  { id: 'm43', file: 'NGC.csv', row: 'NGC1982', type: 'HII', ra: '05:35:31.38', dec: '-05:16:02.9', constellation: 'Ori', major: 20, minor: 15, designations: ['M 43', 'NGC 1982'], name: "Mairan's Nebula", nameSource: 'OpenNGC' },
  { id: 'ngc1977', file: 'NGC.csv', row: 'NGC1977', type: 'Cl+N', ra: '05:35:15.80', dec: '-04:50:39.6', constellation: 'Ori', major: 10.2, minor: null, designations: ['NGC 1977'], name: 'Running Man Nebula', nameSource: 'OpenNGC' },
  { id: 'b33', file: 'addendum.csv', row: 'B033', type: 'DrkN', ra: '05:40:59.0', dec: '-02:27:30', constellation: 'Ori', major: 6, minor: 4, designations: ['B 33', 'Barnard 33'], name: 'Horsehead Nebula', nameSource: 'OpenNGC' },
  { id: 'ic434', file: 'NGC.csv', row: 'IC0434', type: 'HII', ra: '05:41:00.88', dec: '-02:27:13.6', constellation: 'Ori', major: 90, minor: 30, designations: ['IC 434', 'LBN 953'], name: 'IC 434', aliases: ['Orion B', 'Horsehead region'], note: 'The Horsehead Nebula (B 33) is an absorption patch in this nebula.' },
  { id: 'ngc2024', file: 'NGC.csv', row: 'NGC2024', type: 'Neb', ra: '05:41:42.57', dec: '-01:51:22.6', constellation: 'Ori', major: 30, minor: 30, designations: ['NGC 2024'], name: 'Flame Nebula', nameSource: 'common usage' },
  { id: 'm78', file: 'NGC.csv', row: 'NGC2068', type: 'RfN', ra: '05:46:45.82', dec: '+00:04:45.5', constellation: 'Ori', major: 4.5, minor: null, designations: ['M 78', 'NGC 2068'] },
  { id: 'ngc1909', file: 'NGC.csv', row: 'NGC1909', type: 'RfN', ra: '05:04:55.44', dec: '-07:15:56.3', constellation: 'Eri', major: 180, minor: 60, designations: ['NGC 1909', 'IC 2118', 'LBN 959'], name: 'Witch Head Nebula', nameSource: 'OpenNGC', note: 'OpenNGC: identification as NGC 1909 is uncertain (IC 2118 is the same object).' },
  { id: 'ngc1499', file: 'NGC.csv', row: 'NGC1499', type: 'Neb', ra: '04:03:14.42', dec: '+36:22:02.9', constellation: 'Per', major: 160, minor: 40, designations: ['NGC 1499', 'LBN 756'], name: 'California Nebula', nameSource: 'OpenNGC' },
  { id: 'm45', file: 'addendum.csv', row: 'Mel022', type: 'OCl', ra: '03:47:28.6', dec: '+24:06:19', constellation: 'Tau', major: 150, minor: 150, designations: ['M 45', 'Mel 22'], name: 'Pleiades', nameSource: 'OpenNGC', aliases: ['Seven Sisters'] },
  { id: 'c41', file: 'addendum.csv', row: 'C041', type: 'OCl', ra: '04:26:54.0', dec: '+15:52:00', constellation: 'Tau', major: 329, minor: null, designations: ['C 41', 'Mel 25', 'Cl 050'], name: 'Hyades', nameSource: 'OpenNGC' },
  { id: 'm1', file: 'NGC.csv', row: 'NGC1952', type: 'SNR', ra: '05:34:31.97', dec: '+22:00:52.1', constellation: 'Tau', major: 8, minor: 4, designations: ['M 1', 'NGC 1952', 'LBN 833'], name: 'Crab Nebula', nameSource: 'OpenNGC', note: 'OpenNGC position is for the Crab pulsar.' },
  { id: 'ic405', file: 'NGC.csv', row: 'IC0405', type: 'Neb', ra: '05:16:29.48', dec: '+34:21:22.2', constellation: 'Aur', major: 50, minor: 30, designations: ['IC 405', 'C 31', 'LBN 795'], name: 'Flaming Star Nebula', nameSource: 'OpenNGC' },
  { id: 'ic410', file: 'NGC.csv', row: 'IC0410', type: 'Neb', ra: '05:22:42.00', dec: '+33:22:00.0', constellation: 'Aur', major: 40, minor: 30, designations: ['IC 410', 'LBN 807'], name: 'Tadpoles Nebula', nameSource: 'common usage', note: 'OpenNGC: coordinates from Corwin; NED lists this object as a duplicate of NGC 1893.' },
  { id: 'm36', file: 'NGC.csv', row: 'NGC1960', type: 'OCl', ra: '05:36:17.74', dec: '+34:08:26.7', constellation: 'Aur', major: 7.2, minor: null, designations: ['M 36', 'NGC 1960'] },
  { id: 'm38', file: 'NGC.csv', row: 'NGC1912', type: 'OCl', ra: '05:28:42.49', dec: '+35:51:17.7', constellation: 'Aur', major: 9.6, minor: null, designations: ['M 38', 'NGC 1912'] },
  { id: 'm35', file: 'NGC.csv', row: 'NGC2168', type: 'OCl', ra: '06:09:05.06', dec: '+24:20:19.1', constellation: 'Gem', major: 24, minor: null, designations: ['M 35', 'NGC 2168'] },
  { id: 'ic443', file: 'NGC.csv', row: 'IC0443', type: 'SNR', ra: '06:16:37.41', dec: '+22:31:54.0', constellation: 'Gem', major: 50, minor: 40, designations: ['IC 443', 'LBN 844'], name: 'Jellyfish Nebula', nameSource: 'common usage', aliases: ['Gem A'] },
  { id: 'ngc2174', file: 'NGC.csv', row: 'NGC2174', type: 'Neb', ra: '06:09:23.62', dec: '+20:39:34.5', constellation: 'Ori', major: 40, minor: 30, designations: ['NGC 2174'], name: 'Monkey Head Nebula', nameSource: 'OpenNGC' },
  { id: 'ngc2237', file: 'NGC.csv', row: 'NGC2238', type: 'HII', ra: '06:30:40.37', dec: '+05:00:47.0', constellation: 'Mon', major: 80, minor: 60, designations: ['NGC 2237', 'NGC 2238', 'C 49', 'LBN 948'], name: 'Rosette Nebula', nameSource: 'OpenNGC', note: 'Values from the OpenNGC row NGC 2238, which carries the name Rosette Nebula; NGC 2237 (Rosette A) is its brightest part.' },
  { id: 'ngc2264', file: 'NGC.csv', row: 'NGC2264', type: 'Cl+N', ra: '06:40:58.25', dec: '+09:53:43.7', constellation: 'Mon', major: 11.4, minor: null, designations: ['NGC 2264', 'LBN 911'], name: 'Christmas Tree Cluster', nameSource: 'OpenNGC', aliases: ['Cone Nebula'] },
  { id: 'ic2177', file: 'NGC.csv', row: 'IC2177', type: 'RfN', ra: '07:04:36.91', dec: '-10:28:15.8', constellation: 'Mon', major: 20, minor: 20, designations: ['IC 2177', 'LBN 1027'], name: 'Seagull Nebula', nameSource: 'common usage' },
  { id: 'm44', file: 'NGC.csv', row: 'NGC2632', type: 'OCl', ra: '08:40:22.20', dec: '+19:40:19.4', constellation: 'Cnc', major: 108.6, minor: null, designations: ['M 44', 'NGC 2632'], name: 'Beehive', nameSource: 'OpenNGC', aliases: ['Praesepe Cluster'] },
  // --- Cassiopeia, Perseus, Cepheus, Cygnus (northern Milky Way) ---
  { id: 'c14', file: 'addendum.csv', row: 'C014', type: '*Ass', ra: '02:20:42.0', dec: '+57:08:15', constellation: 'Per', major: 50, minor: 50, designations: ['C 14', 'NGC 869', 'NGC 884'], name: 'Double Cluster', nameSource: 'OpenNGC', aliases: ['h & chi Persei'] },
  { id: 'ic1805', file: 'NGC.csv', row: 'IC1805', type: 'Cl+N', ra: '02:32:41.51', dec: '+61:27:24.8', constellation: 'Cas', major: 60, minor: 60, designations: ['IC 1805', 'LBN 654'], name: 'Heart Nebula', nameSource: 'common usage' },
  { id: 'ic1848', file: 'NGC.csv', row: 'IC1848', type: 'Cl+N', ra: '02:51:10.59', dec: '+60:24:08.9', constellation: 'Cas', major: 40, minor: 10, designations: ['IC 1848', 'LBN 667'], name: 'Soul Nebula', nameSource: 'common usage' },
  { id: 'ngc281', file: 'NGC.csv', row: 'NGC0281', type: 'HII', ra: '00:52:59.35', dec: '+56:37:18.8', constellation: 'Cas', major: 35, minor: 30, designations: ['NGC 281', 'IC 11', 'LBN 616'], name: 'Pacman Nebula', nameSource: 'common usage' },
  { id: 'ngc7635', file: 'NGC.csv', row: 'NGC7635', type: 'HII', ra: '23:20:45.60', dec: '+61:12:44.5', constellation: 'Cas', major: 15, minor: 8, designations: ['NGC 7635', 'C 11', 'LBN 548'], name: 'Bubble Nebula', nameSource: 'OpenNGC' },
  { id: 'c9', file: 'addendum.csv', row: 'C009', type: 'HII', ra: '22:57:54.0', dec: '+62:31:06', constellation: 'Cep', major: 50, minor: 30, designations: ['C 9', 'Sh2-155', 'LBN 529'], name: 'Cave Nebula', nameSource: 'OpenNGC' },
  { id: 'ic1396', file: 'NGC.csv', row: 'IC1396', type: 'Cl+N', ra: '21:38:57.62', dec: '+57:29:20.6', constellation: 'Cep', major: 14, minor: 4, designations: ['IC 1396', 'LBN 451', 'LBN 452'], name: "Elephant's Trunk region", nameSource: 'common usage', note: 'OpenNGC position is for the star HD 206267 at the heart of the large IC 1396 nebula.' },
  { id: 'ngc7023', file: 'NGC.csv', row: 'NGC7023', type: 'Neb', ra: '21:01:35.62', dec: '+68:10:10.4', constellation: 'Cep', major: 10, minor: 8, designations: ['NGC 7023', 'C 4', 'LBN 487'], name: 'Iris Nebula', nameSource: 'OpenNGC' },
  { id: 'ngc7000', file: 'NGC.csv', row: 'NGC7000', type: 'HII', ra: '20:59:17.14', dec: '+44:31:43.6', constellation: 'Cyg', major: 120, minor: 30, designations: ['NGC 7000', 'C 20', 'LBN 373'], name: 'North America Nebula', nameSource: 'OpenNGC' },
  { id: 'ic5070', file: 'NGC.csv', row: 'IC5070', type: 'HII', ra: '20:51:00.72', dec: '+44:24:05.4', constellation: 'Cyg', major: 60, minor: 50, designations: ['IC 5070', 'LBN 350'], name: 'Pelican Nebula', nameSource: 'OpenNGC' },
  { id: 'ic5146', file: 'NGC.csv', row: 'IC5146', type: 'Cl+N', ra: '21:53:28.76', dec: '+47:16:00.9', constellation: 'Cyg', major: 10, minor: 10, designations: ['IC 5146', 'C 19', 'LBN 424'], name: 'Cocoon Nebula', nameSource: 'OpenNGC', note: 'OpenNGC position is for the included star.' },
  { id: 'ngc6888', file: 'NGC.csv', row: 'NGC6888', type: 'HII', ra: '20:12:06.55', dec: '+38:21:17.8', constellation: 'Cyg', major: 20, minor: 10, designations: ['NGC 6888', 'C 27', 'LBN 203'], name: 'Crescent Nebula', nameSource: 'OpenNGC' },
  { id: 'ngc6960', file: 'NGC.csv', row: 'NGC6960', type: 'SNR', ra: '20:45:58.18', dec: '+30:35:42.5', constellation: 'Cyg', major: 210, minor: 160, designations: ['NGC 6960', 'C 34', 'LBN 191'], name: 'Western Veil', nameSource: 'OpenNGC', aliases: ['Veil Nebula', 'Filamentary Nebula'], note: 'OpenNGC gives the size of the whole Veil complex for this row.' },
  { id: 'ngc6992', file: 'NGC.csv', row: 'NGC6992', type: 'SNR', ra: '20:56:19.07', dec: '+31:44:33.9', constellation: 'Cyg', major: 60, minor: 8, designations: ['NGC 6992', 'C 33'], name: 'Eastern Veil', nameSource: 'OpenNGC', aliases: ['Network Nebula'] },
  { id: 'cr399', file: 'addendum.csv', row: 'Cl399', type: '*Ass', ra: '19:25:24.0', dec: '+20:11:00', constellation: 'Vul', major: 70, minor: null, designations: ['Cr 399', 'Collinder 399'], name: 'Coathanger Asterism', nameSource: 'OpenNGC', aliases: ["Brocchi's Cluster", "Al Sufi's Cluster"] },
  { id: 'm27', file: 'NGC.csv', row: 'NGC6853', type: 'PN', ra: '19:59:36.38', dec: '+22:43:15.7', constellation: 'Vul', major: 6.7, minor: null, designations: ['M 27', 'NGC 6853'], name: 'Dumbbell Nebula', nameSource: 'OpenNGC' },
  { id: 'm57', file: 'NGC.csv', row: 'NGC6720', type: 'PN', ra: '18:53:35.01', dec: '+33:01:42.9', constellation: 'Lyr', major: 1.27, minor: null, designations: ['M 57', 'NGC 6720'], name: 'Ring Nebula', nameSource: 'OpenNGC' },
  { id: 'm13', file: 'NGC.csv', row: 'NGC6205', type: 'GCl', ra: '16:41:41.63', dec: '+36:27:40.7', constellation: 'Her', major: 16.5, minor: null, designations: ['M 13', 'NGC 6205'], name: 'Hercules Globular Cluster', nameSource: 'OpenNGC' },
  // --- Sagittarius, Scorpius, Ophiuchus, Scutum, Serpens (around the galactic centre) ---
  { id: 'm8', file: 'NGC.csv', row: 'NGC6523', type: 'Neb', ra: '18:03:41.27', dec: '-24:22:48.6', constellation: 'Sgr', major: 45, minor: 30, designations: ['M 8', 'NGC 6523', 'NGC 6533', 'LBN 25'], name: 'Lagoon Nebula', nameSource: 'OpenNGC' },
  { id: 'm20', file: 'NGC.csv', row: 'NGC6514', type: 'Neb', ra: '18:02:42.11', dec: '-22:58:18.8', constellation: 'Sgr', major: 28, minor: 28, designations: ['M 20', 'NGC 6514', 'LBN 27'], name: 'Trifid Nebula', nameSource: 'OpenNGC' },
  { id: 'm24', file: 'NGC.csv', row: 'IC4715', type: '*Ass', ra: '18:16:56.12', dec: '-18:30:52.4', constellation: 'Sgr', major: 120, minor: 60, designations: ['M 24', 'IC 4715'], name: 'Small Sagittarius Star Cloud', nameSource: 'OpenNGC', aliases: ['Small Sgr Star Cloud'] },
  { id: 'm17', file: 'NGC.csv', row: 'NGC6618', type: 'Neb', ra: '18:20:47.11', dec: '-16:10:17.5', constellation: 'Sgr', major: 12.6, minor: null, designations: ['M 17', 'NGC 6618', 'LBN 60'], name: 'Omega Nebula', nameSource: 'OpenNGC', aliases: ['Swan Nebula', 'Lobster Nebula', 'Checkmark Nebula'] },
  { id: 'm16', file: 'NGC.csv', row: 'NGC6611', type: 'Neb', ra: '18:18:48.17', dec: '-13:48:26.0', constellation: 'Ser', major: 120, minor: 25, designations: ['M 16', 'NGC 6611', 'LBN 67'], name: 'Eagle Nebula', nameSource: 'OpenNGC' },
  { id: 'm22', file: 'NGC.csv', row: 'NGC6656', type: 'GCl', ra: '18:36:24.20', dec: '-23:54:12.3', constellation: 'Sgr', major: 12.6, minor: null, designations: ['M 22', 'NGC 6656'] },
  { id: 'm11', file: 'NGC.csv', row: 'NGC6705', type: 'OCl', ra: '18:51:05.99', dec: '-06:16:12.1', constellation: 'Sct', major: 9, minor: null, designations: ['M 11', 'NGC 6705'], name: 'Wild Duck Cluster', nameSource: 'OpenNGC', aliases: ["Amas de l'Ecu de Sobieski"] },
  { id: 'm6', file: 'NGC.csv', row: 'NGC6405', type: 'OCl', ra: '17:40:20.75', dec: '-32:15:15.0', constellation: 'Sco', major: 15.6, minor: null, designations: ['M 6', 'NGC 6405'], name: 'Butterfly Cluster', nameSource: 'OpenNGC' },
  { id: 'm7', file: 'NGC.csv', row: 'NGC6475', type: 'OCl', ra: '17:53:51.18', dec: '-34:47:34.2', constellation: 'Sco', major: 22.2, minor: null, designations: ['M 7', 'NGC 6475'], name: "Ptolemy's Cluster", nameSource: 'OpenNGC' },
  { id: 'ngc6357', file: 'NGC.csv', row: 'NGC6357', type: 'Cl+N', ra: '17:24:43.57', dec: '-34:12:04.8', constellation: 'Sco', major: 3.9, minor: null, designations: ['NGC 6357'], name: 'War and Peace Nebula', nameSource: 'OpenNGC', note: 'OpenNGC size is for the cluster; the emission nebula is far larger.' },
  { id: 'ngc6334', file: 'NGC.csv', row: 'NGC6334', type: 'SNR', ra: '17:20:49.70', dec: '-36:06:09.8', constellation: 'Sco', major: 8.4, minor: null, designations: ['NGC 6334'], name: "Cat's Paw Nebula", nameSource: 'common usage', note: "OpenNGC types this row 'SNR' with an 8.4 arcmin axis; the nebula photographers frame extends well beyond that." },
  { id: 'm4', file: 'NGC.csv', row: 'NGC6121', type: 'GCl', ra: '16:23:35.40', dec: '-26:31:31.9', constellation: 'Sco', major: 28.2, minor: null, designations: ['M 4', 'NGC 6121'] },
  { id: 'ic4604', file: 'NGC.csv', row: 'IC4604', type: 'Neb', ra: '16:25:31.17', dec: '-23:26:11.7', constellation: 'Oph', major: 60, minor: 25, designations: ['IC 4604', 'LBN 1111'], name: 'Rho Ophiuchi Nebula', nameSource: 'OpenNGC', aliases: ['rho Oph Nebula', 'Rho Ophiuchi cloud complex'] },
  { id: 'ic4592', file: 'NGC.csv', row: 'IC4592', type: 'RfN', ra: '16:11:58.67', dec: '-19:27:16.8', constellation: 'Sco', major: 60, minor: 40, designations: ['IC 4592', 'LBN 1113'], name: 'Blue Horsehead Nebula', nameSource: 'common usage', note: 'OpenNGC position is on the star nu2 Scorpii.' },
  { id: 'ic4628', file: 'NGC.csv', row: 'IC4628', type: 'Neb', ra: '16:56:58.43', dec: '-40:27:03.5', constellation: 'Sco', major: 89.13, minor: 58.88, designations: ['IC 4628'], name: 'Prawn Nebula', nameSource: 'common usage' },
  { id: 'ngc6188', file: 'NGC.csv', row: 'NGC6188', type: 'Neb', ra: '16:40:05.84', dec: '-48:39:44.2', constellation: 'Ara', major: 20, minor: 12, designations: ['NGC 6188'], name: 'Rim Nebula', nameSource: 'OpenNGC', aliases: ['Fighting Dragons of Ara'] },
  { id: 'ngc6727', file: 'NGC.csv', row: 'NGC6727', type: 'RfN', ra: '19:01:42.27', dec: '-36:52:34.5', constellation: 'CrA', major: 80, minor: 80, designations: ['NGC 6727'], name: 'Corona Australis Nebula', nameSource: 'common usage', aliases: ['NGC 6726'] },
  // --- Southern sky: Carina, Crux, Centaurus, Vela, Tucana, Dorado ---
  { id: 'ngc3372', file: 'NGC.csv', row: 'NGC3372', type: 'HII', ra: '10:45:08.53', dec: '-59:52:00.1', constellation: 'Car', major: 120, minor: 120, designations: ['NGC 3372', 'C 92'], name: 'Carina Nebula', nameSource: 'OpenNGC', aliases: ['eta Car Nebula', 'Eta Carinae Nebula'] },
  { id: 'ngc3532', file: 'NGC.csv', row: 'NGC3532', type: 'OCl', ra: '11:05:47.82', dec: '-58:46:13.8', constellation: 'Car', major: 12, minor: null, designations: ['NGC 3532', 'C 91'], name: 'Wishing Well Cluster', nameSource: 'OpenNGC' },
  { id: 'ic2602', file: 'NGC.csv', row: 'IC2602', type: 'OCl', ra: '10:42:57.47', dec: '-64:23:39.1', constellation: 'Car', major: 48, minor: null, designations: ['IC 2602', 'C 102'], name: 'theta Carinae Cluster', nameSource: 'OpenNGC', aliases: ['tet Car Cluster', 'Southern Pleiades'] },
  { id: 'ic2391', file: 'NGC.csv', row: 'IC2391', type: 'OCl', ra: '08:40:31.88', dec: '-53:02:07.7', constellation: 'Vel', major: 29.1, minor: null, designations: ['IC 2391', 'C 85'], name: 'omicron Velorum Cluster', nameSource: 'OpenNGC', aliases: ['omi Vel Cluster'] },
  { id: 'ic2944', file: 'NGC.csv', row: 'IC2944', type: 'Cl+N', ra: '11:35:46.93', dec: '-63:01:11.4', constellation: 'Cen', major: 7.2, minor: null, designations: ['IC 2944', 'C 100'], name: 'lambda Centauri Nebula', nameSource: 'OpenNGC', aliases: ['lam Cen Nebula', 'Running Chicken Nebula'], note: 'OpenNGC position is for lambda Centauri, roughly centred in the 40 x 20 arcmin nebula.' },
  { id: 'ngc4755', file: 'NGC.csv', row: 'NGC4755', type: 'OCl', ra: '12:53:37.08', dec: '-60:21:22.7', constellation: 'Cru', major: 7.8, minor: null, designations: ['NGC 4755', 'C 94'], name: "Herschel's Jewel Box", nameSource: 'OpenNGC', aliases: ['Jewel Box', 'kappa Crucis Cluster'] },
  { id: 'c99', file: 'addendum.csv', row: 'C099', type: 'DrkN', ra: '12:31:19.0', dec: '-63:44:36', constellation: 'Cru', major: null, minor: null, designations: ['C 99'], name: 'Coalsack Nebula', nameSource: 'OpenNGC', aliases: ['Coalsack'] },
  { id: 'ngc5139', file: 'NGC.csv', row: 'NGC5139', type: 'GCl', ra: '13:26:45.89', dec: '-47:28:36.7', constellation: 'Cen', major: 27, minor: null, designations: ['NGC 5139', 'C 80'], name: 'Omega Centauri', nameSource: 'OpenNGC' },
  { id: 'ngc5128', file: 'NGC.csv', row: 'NGC5128', type: 'G', ra: '13:25:27.62', dec: '-43:01:08.8', constellation: 'Cen', major: 25.88, minor: 19.77, designations: ['NGC 5128', 'C 77'], name: 'Centaurus A', nameSource: 'OpenNGC' },
  { id: 'ngc104', file: 'NGC.csv', row: 'NGC0104', type: 'GCl', ra: '00:24:05.36', dec: '-72:04:53.2', constellation: 'Tuc', major: 31.8, minor: null, designations: ['NGC 104', 'C 106'], name: '47 Tucanae', nameSource: 'OpenNGC', aliases: ['47 Tuc Cluster'] },
  { id: 'ngc292', file: 'NGC.csv', row: 'NGC0292', type: 'G', ra: '00:52:44.78', dec: '-72:49:43.0', constellation: 'Tuc', major: 299.92, minor: 179.89, designations: ['NGC 292'], name: 'Small Magellanic Cloud', nameSource: 'OpenNGC', aliases: ['SMC'] },
  { id: 'eso56-115', file: 'addendum.csv', row: 'ESO056-115', type: 'G', ra: '05:23:34.5', dec: '-69:45:22', constellation: 'Dor', major: 646, minor: 550, designations: ['ESO 56-115', 'PGC 17223'], name: 'Large Magellanic Cloud', nameSource: 'OpenNGC', aliases: ['LMC', 'Nubecula Major'] },
  { id: 'ngc2070', file: 'NGC.csv', row: 'NGC2070', type: 'HII', ra: '05:38:42.36', dec: '-69:06:03.2', constellation: 'Dor', major: 16, minor: 16, designations: ['NGC 2070', 'C 103'], name: 'Tarantula Nebula', nameSource: 'OpenNGC', aliases: ['30 Doradus', '30 Dor Cluster'] },
  { id: 'ngc7293', file: 'NGC.csv', row: 'NGC7293', type: 'PN', ra: '22:29:38.57', dec: '-20:50:14.4', constellation: 'Aqr', major: 16.33, minor: null, designations: ['NGC 7293', 'C 63'], name: 'Helix Nebula', nameSource: 'OpenNGC' },
  // --- Galaxies and clusters away from the Milky Way ---
  { id: 'm31', file: 'NGC.csv', row: 'NGC0224', type: 'G', ra: '00:42:44.35', dec: '+41:16:08.6', constellation: 'And', major: 177.83, minor: 69.66, designations: ['M 31', 'NGC 224'], name: 'Andromeda Galaxy', nameSource: 'OpenNGC' },
  { id: 'm33', file: 'NGC.csv', row: 'NGC0598', type: 'G', ra: '01:33:50.89', dec: '+30:39:36.8', constellation: 'Tri', major: 62.09, minor: 36.73, designations: ['M 33', 'NGC 598'], name: 'Triangulum Galaxy', nameSource: 'OpenNGC', aliases: ['Triangulum Pinwheel'] },
  { id: 'ngc253', file: 'NGC.csv', row: 'NGC0253', type: 'G', ra: '00:47:33.12', dec: '-25:17:17.6', constellation: 'Scl', major: 26.79, minor: 4.58, designations: ['NGC 253', 'C 65'], name: 'Sculptor Galaxy', nameSource: 'common usage', aliases: ['Silver Coin', 'Sculptor Filament'] },
  { id: 'm81', file: 'NGC.csv', row: 'NGC3031', type: 'G', ra: '09:55:33.17', dec: '+69:03:55.1', constellation: 'UMa', major: 21.63, minor: 11.25, designations: ['M 81', 'NGC 3031'], name: "Bode's Galaxy", nameSource: 'OpenNGC' },
  { id: 'm82', file: 'NGC.csv', row: 'NGC3034', type: 'G', ra: '09:55:52.73', dec: '+69:40:45.8', constellation: 'UMa', major: 10.99, minor: 5.11, designations: ['M 82', 'NGC 3034'], name: 'Cigar Galaxy', nameSource: 'OpenNGC' },
  { id: 'm101', file: 'NGC.csv', row: 'NGC5457', type: 'G', ra: '14:03:12.54', dec: '+54:20:56.2', constellation: 'UMa', major: 23.99, minor: 23.07, designations: ['M 101', 'NGC 5457'], name: 'Pinwheel Galaxy', nameSource: 'common usage' },
  { id: 'mel111', file: 'addendum.csv', row: 'Mel111', type: 'OCl', ra: '12:25:06.0', dec: '+26:06:00', constellation: 'Com', major: 253.5, minor: null, designations: ['Mel 111'], name: 'Coma Star Cluster', nameSource: 'OpenNGC' },
];

/** Parses 'hh:mm:ss.s' to hours. */
function parseRaHours(text: string): number {
  const [h, m, s] = text.split(':').map(Number);
  return (h ?? NaN) + (m ?? NaN) / 60 + (s ?? NaN) / 3600;
}

/** Parses '+dd:mm:ss.s' / '-dd:mm:ss' to degrees. */
function parseDecDeg(text: string): number {
  const sign = text.startsWith('-') ? -1 : 1;
  const [d, m, s] = text.replace(/^[+-]/, '').split(':').map(Number);
  return sign * ((d ?? NaN) + (m ?? NaN) / 60 + (s ?? NaN) / 3600);
}

function toTarget(row: Row): Target {
  const target: Target = {
    id: row.id,
    name: row.name ?? row.designations[0] ?? row.id,
    nameSource: row.name ? (row.nameSource ?? 'designation') : 'designation',
    designations: row.designations,
    aliases: row.aliases ?? [],
    type: TYPE_OF[row.type],
    openNgcType: row.type,
    raHours: parseRaHours(row.ra),
    decDeg: parseDecDeg(row.dec),
    sizeArcmin: row.major === null ? null : { major: row.major, minor: row.minor ?? row.major },
    constellation: row.constellation,
    openNgcRow: `${row.file} ${row.row}`,
  };
  if (row.note) target.note = row.note;
  return target;
}

/** The galactic centre as a target: galactic l = 0, b = 0 (IAU frame as in astropy). */
const GALACTIC_CENTRE_TARGET: Target = {
  id: 'galactic-centre',
  name: 'Galactic Centre',
  nameSource: 'IAU galactic frame',
  designations: ['Galactic Centre'],
  aliases: ['Galactic Center', 'Milky Way core', 'Milky Way centre', 'GC'],
  type: 'galactic-centre',
  raHours: GALACTIC_CENTRE_J2000.raHours,
  decDeg: GALACTIC_CENTRE_J2000.decDeg,
  sizeArcmin: null,
  constellation: 'Sgr',
  note: 'Origin of galactic coordinates (l = 0, b = 0); the radio source Sgr A* lies 4.4 arcmin away.',
};

/** All targets: the galactic centre first, then the OpenNGC objects in the order above. Frozen. */
export const TARGETS: readonly Target[] = Object.freeze([GALACTIC_CENTRE_TARGET, ...ROWS.map(toTarget)].map((t) => Object.freeze(t)));

const BY_ID = new Map(TARGETS.map((t) => [t.id, t]));

const PREFIX_WORDS: Array<[RegExp, string]> = [
  [/^messier/, 'm'],
  [/^caldwell/, 'c'],
  [/^melotte/, 'mel'],
  [/^collinder/, 'cr'],
  [/^barnard/, 'b'],
  [/^sharpless2?/, 'sh2'],
];

/**
 * Normalizes a name or designation for matching: lower case, accents and everything but letters,
 * digits and '-' removed, leading zeros of catalogue numbers dropped, long catalogue names
 * shortened ('Messier 42' -> 'm42', 'NGC 0224' -> 'ngc224', 'Sh2-155' -> 'sh2155').
 * @param text any string of at most 200 characters
 * @throws RangeError when `text` is not a string or is too long
 */
export function normalizeForSearch(text: string): string {
  if (typeof text !== 'string') throw new RangeError('text must be a string');
  if (text.length > 200) throw new RangeError('text must be at most 200 characters');
  let s = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]/g, '');
  for (const [re, short] of PREFIX_WORDS) s = s.replace(re, short);
  return s.replace(/([a-z])0+(?=\d)/g, '$1');
}

interface IndexEntry {
  target: Target;
  keys: string[];
  nameKeys: string[];
}

const INDEX: IndexEntry[] = TARGETS.map((target) => ({
  target,
  keys: [target.id, ...target.designations].map(normalizeForSearch),
  nameKeys: [target.name, ...target.aliases].map(normalizeForSearch),
}));

/**
 * The target with this id (case-insensitive), e.g. 'm42', 'ngc7000', 'galactic-centre'.
 * @param id target id, a string of at most 200 characters
 * @returns the target, or undefined when there is none
 * @throws RangeError when `id` is not a string or too long
 */
export function findTarget(id: string): Target | undefined {
  if (typeof id !== 'string') throw new RangeError('id must be a string');
  if (id.length > 200) throw new RangeError('id must be at most 200 characters');
  return BY_ID.get(id.trim().toLowerCase());
}

/**
 * Targets matching a query by name or designation, case-, space- and punctuation-insensitive
 * ("M 42", "orion", "NGC7000", "messier 8", "ngc 0224"), best matches first:
 * exact designation or id, then exact name, then designations starting with the query, then names
 * with a word starting with the query, then names containing it.
 * @param query text of at most 200 characters; an empty query returns no targets
 * @param limit maximum number of results, 1..200 (default 20)
 * @throws RangeError on a non-string or too long query, or a bad limit
 */
export function searchTargets(query: string, limit = 20): Target[] {
  const q = normalizeForSearch(query);
  if (!Number.isInteger(limit) || limit < 1 || limit > 200) throw new RangeError('limit must be an integer 1..200');
  if (q.length === 0) return [];
  const wordPrefix = (name: string): boolean =>
    name
      .normalize('NFKD')
      .toLowerCase()
      .split(/[^a-z0-9]+/)
      .some((w) => w.length > 0 && normalizeForSearch(w).startsWith(q));
  const scored: Array<{ target: Target; score: number; order: number }> = [];
  INDEX.forEach((entry, order) => {
    let score: number | null = null;
    if (entry.keys.includes(q)) score = 0;
    else if (entry.nameKeys.includes(q)) score = 1;
    else if (entry.keys.some((k) => k.startsWith(q))) score = 2;
    else if ([entry.target.name, ...entry.target.aliases].some(wordPrefix)) score = 3;
    else if (entry.nameKeys.some((k) => k.includes(q))) score = 4;
    if (score !== null) scored.push({ target: entry.target, score, order });
  });
  scored.sort((a, b) => a.score - b.score || a.order - b.order);
  return scored.slice(0, limit).map((s) => s.target);
}
