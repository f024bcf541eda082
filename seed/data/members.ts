/**
 * Invented demo members. Every person, handle and address here is made up for the demo; the
 * addresses use the reserved `.test` domain so no mail can reach anyone.
 */

/** One demo account: handle (URL-safe, lower-case kebab), shown name, role, e-mail, short bio. */
export interface SeedMember {
  handle: string;
  displayName: string;
  role: 'member' | 'publisher' | 'moderator' | 'admin';
  email: string;
  bio: string;
}

const at = (handle: string) => `${handle}@example.test`;

/** The demo's members: one admin, two moderators, two publishers, ten members. */
export const members: SeedMember[] = [
  {
    handle: 'site-keeper',
    displayName: 'Ines Varga',
    role: 'admin',
    email: at('site-keeper'),
    bio: 'Invented demo account that looks after roles and site settings. Posts no results.',
  },
  {
    handle: 'grey-hone',
    displayName: 'Ruth Abernathy',
    role: 'moderator',
    email: at('grey-hone'),
    bio: 'Invented demo moderator. Retired toolroom hand who reads every submission twice.',
  },
  {
    handle: 'bevel-and-burr',
    displayName: 'Kofi Mensah-Lowe',
    role: 'moderator',
    email: at('bevel-and-burr'),
    bio: 'Invented demo moderator. Keeps the steel pages tidy and merges duplicates.',
  },
  {
    handle: 'fennick-lane-sharpening',
    displayName: 'Fennick Lane Sharpening',
    role: 'publisher',
    email: at('fennick-lane-sharpening'),
    bio: 'Invented demo publisher: a small sharpening service working mostly on kitchen and workshop knives, posting its bench tests in batches.',
  },
  {
    handle: 'little-tern-lab',
    displayName: 'Little Tern Edge Lab',
    role: 'publisher',
    email: at('little-tern-lab'),
    bio: 'Invented demo publisher: a tiny test lab with one sharpness tester and a card-cutting rig, measuring hardness on every blade.',
  },
  {
    handle: 'hollow-grind-hal',
    displayName: 'Hal Pereira',
    role: 'member',
    email: at('hollow-grind-hal'),
    bio: 'Invented demo member. Weekend woodworker with a water-cooled grinder.',
  },
  {
    handle: 'marta-whets',
    displayName: 'Marta Sobczak',
    role: 'member',
    email: at('marta-whets'),
    bio: 'Invented demo member. Sharpens for a community kitchen.',
  },
  {
    handle: 'kitchen-line-jo',
    displayName: 'Jo Adeyemi',
    role: 'member',
    email: at('kitchen-line-jo'),
    bio: 'Invented demo member. Line cook comparing finishing grits on stainless knives.',
  },
  {
    handle: 'woodcarver-lin',
    displayName: 'Lin Hartley',
    role: 'member',
    email: at('woodcarver-lin'),
    bio: 'Invented demo member. Carves spoons and keeps small carbon-steel blades keen.',
  },
  {
    handle: 'tarn-and-tang',
    displayName: 'Sami Rautio',
    role: 'member',
    email: at('tarn-and-tang'),
    bio: 'Invented demo member. Hobby knifemaker who heat treats in a small kiln.',
  },
  {
    handle: 'slow-stone',
    displayName: 'Bea Castellanos',
    role: 'member',
    email: at('slow-stone'),
    bio: 'Invented demo member. Prefers bench stones and a strop to anything with a motor.',
  },
  {
    handle: 'burr-hunter',
    displayName: 'Dev Raman',
    role: 'member',
    email: at('burr-hunter'),
    bio: 'Invented demo member. Counts cuts on card for fun.',
  },
  {
    handle: 'fen-bladesmith',
    displayName: 'Nell Harrow',
    role: 'member',
    email: at('fen-bladesmith'),
    bio: 'Invented demo member. Forges carbon and spring steels.',
  },
  {
    handle: 'microbevel-max',
    displayName: 'Max Ostrowski',
    role: 'member',
    email: at('microbevel-max'),
    bio: 'Invented demo member. Tries every angle once and writes down what happened.',
  },
  {
    handle: 'ridge-and-heel',
    displayName: 'Priya Lund',
    role: 'member',
    email: at('ridge-and-heel'),
    bio: 'Invented demo member. Sharpens tool-steel chisels and plane irons on superabrasive wheels.',
  },
];
