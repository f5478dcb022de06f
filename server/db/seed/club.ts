// The demo scenario: an invented cheese club in an invented town. Every person, place and
// word here is made up for the demo.

export const DEMO_CLUB = {
  name: 'Brackwater Hollow Curd Circle',
  town: 'Brackwater Hollow',
};

type DemoMember = {
  email: string;
  handle: string;
  displayName: string;
  password: string;
  role: 'member' | 'moderator' | 'admin';
  units: 'metric' | 'us';
  bio: string;
};

export const DEMO_MEMBERS: DemoMember[] = [
  {
    email: 'odile@brackwater.invalid',
    handle: 'odile',
    displayName: 'Odile Farrant',
    password: 'whey-kettle-lantern-41',
    role: 'admin',
    units: 'metric',
    bio: "Keeps the Circle's cave log and the press in the old dairy shed. Mostly cheddars and tommes.",
  },
  {
    email: 'tobiah@brackwater.invalid',
    handle: 'tobiah',
    displayName: 'Tobiah Quense',
    password: 'cloth-bound-rafters-77',
    role: 'moderator',
    units: 'us',
    bio: 'Goat keeper on the east lane. Lactic cheeses in summer, washed rinds in winter.',
  },
  {
    email: 'marit@brackwater.invalid',
    handle: 'marit',
    displayName: 'Marit Vell',
    password: 'brine-crock-sparrow-12',
    role: 'member',
    units: 'metric',
    bio: 'Second-year maker. Learning goudas and writing everything down.',
  },
  {
    email: 'casimir@brackwater.invalid',
    handle: 'casimir',
    displayName: 'Casimir Hoade',
    password: 'press-spring-orchard-58',
    role: 'member',
    units: 'us',
    bio: "Sheep's milk from a neighbour's flock; long-aged hard cheeses and a stubborn blue.",
  },
  {
    email: 'juna@brackwater.invalid',
    handle: 'juna',
    displayName: 'Juna Pellisent',
    password: 'curd-knife-meadow-93',
    role: 'member',
    units: 'metric',
    bio: 'Fresh cheeses for the market stall, and one cheddar a month to see what happens.',
  },
];
