#!/usr/bin/env node
// Seeded generator for the invented "Glimmerholt Ferries" demo corpora.
//
// Everything here is made up: the operator, its harbours, ships, lounges, staff and passengers.
// Output is deterministic: a small PRNG with fixed seeds (no Math.random, no clock), so two runs
// write byte-identical files.
//
// Writes, next to this script:
//   ferry-messages.csv    id,text,topic,sentiment  (RFC 4180 quoting, LF line ends)
//   ferry-messages.jsonl  one {"text","topic"} object a line
//   ferry-folder/<topic>/<id>.txt  one message a file, label = folder
//
// Usage: node corpora-demo/make-demo.mjs

import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const OUT_DIR = dirname(fileURLToPath(import.meta.url));
const CSV_DOCS = 4000;
const JSONL_DOCS = 300;
const FOLDER_DOCS = 150;

// ---------------------------------------------------------------------------------------------
// Random numbers: mulberry32, a tiny 32-bit generator; good enough for demo text.

/** @param {number} seed */
function mulberry32(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Convenience wrapper around one PRNG stream. */
class Rng {
  /** @param {number} seed */
  constructor(seed) {
    this.next = mulberry32(seed);
  }
  /** Integer in [lo, hi], both ends included. */
  int(lo, hi) {
    return lo + Math.floor(this.next() * (hi - lo + 1));
  }
  /** True with probability p. */
  chance(p) {
    return this.next() < p;
  }
  /** @template T @param {readonly T[]} items @returns {T} */
  pick(items) {
    return items[Math.floor(this.next() * items.length)];
  }
  /** @template T @param {ReadonlyArray<readonly [T, number]>} pairs value/weight pairs @returns {T} */
  weighted(pairs) {
    let total = 0;
    for (const [, w] of pairs) total += w;
    let r = this.next() * total;
    for (const [v, w] of pairs) {
      r -= w;
      if (r < 0) return v;
    }
    return pairs[pairs.length - 1][0];
  }
}

/** Zipf-like weights so the first names in a list are common and the last ones rare. */
const zipf = (items, s = 1.1) => items.map((v, i) => /** @type {const} */ ([v, 1 / (i + 1) ** s]));

// ---------------------------------------------------------------------------------------------
// The invented world.

const OPERATOR = ['Glimmerholt', 'Glimmerholt Ferries', 'Glimmerholt Ferries', 'GF', 'you lot', 'Glimmerholt Ferry Line'];
const HANDLE = '@GlimmerholtFerries';
const DOMAIN = 'glimmerholt.example';

// Common harbours first, a long tail of small piers after.
const HARBOURS = zipf([
  'Varnhollow', 'Tiverack', 'Merrowdeep', 'Orrisfold', 'Caddleby', 'Penwhistle', 'Lunnock Quay',
  'Skellan Point', 'Elsketh', 'Saltmorrow', 'Ferngullet', 'Hobblestrand', 'Wickerholm',
  'Little Skerrowby', 'Quennick Steps', 'Oddlemere', 'Trallow Sands', 'Yarrowsea Pier',
]);

const SHIPS = zipf([
  'Tiverack Maid', 'Orrisfold Star', 'Pennywren', 'Hollin Grace', 'Marrowlight', 'Bramble Tern',
  'Saltlark', 'Quillet Rose', 'Lantern of Caddleby', 'Elsketh Venture', 'Gullwhistle', 'Old Fennamor',
]);

// Syllables for procedurally named lounges and cabins: a long tail of rare words.
const SYL_A = ['Fen', 'Quor', 'Brae', 'Mell', 'Ost', 'Tarr', 'Vell', 'Kib', 'Orr', 'Dun', 'Sca', 'Lir', 'Hask', 'Gwen', 'Pell', 'Thorn', 'Wyn', 'Carr'];
const SYL_B = ['o', 'a', 'e', 'i', 'er', 'an', 'el', 'ow', 'ish', 'am'];
const SYL_C = ['wick', 'mere', 'holt', 'ridge', 'by', 'stow', 'garth', 'ling', 'ford', 'crest', 'vane', 'lock', 'ham', 'moor'];

const FIRST_NAMES = [
  'Maud', 'Tobin', 'Ysolde', 'Perrin', 'Aneka', 'Corwin', 'Lissa', 'Hamish', 'Oona', 'Bram', 'Delphine',
  'Jory', 'Saoirse', 'Idris', 'Marit', 'Osric', 'Tamsin', 'Wendel', 'Priya', 'Kofi', 'Ines', 'Lorcan',
  'Nell', 'Rafe', 'Esmé', 'Jonas', 'Agnieszka', 'Ferdie', 'Hild', 'Ciarán', 'Mirela', 'Ottilie',
];
const SURNAMES = ['Quarrie', 'Vennick', 'Tallowby', 'Marchbank', 'Skerrit', 'Oddlow', 'Pennock', 'Haverstraw', 'Dunmallow', 'Crabbe-Ives'];

const ITEMS = [
  'phone', 'wallet', 'purse', 'rucksack', 'umbrella', 'teddy bear', 'glasses', 'hearing aid', 'laptop',
  'scarf', 'e-reader', 'camera', 'car keys', 'passport', 'water bottle', 'headphones', 'raincoat',
  'walking stick', 'toy dinosaur', 'knitting bag', 'bobble hat', 'sketchbook', 'dog lead', 'tablet',
];
const COLOURS = ['black', 'red', 'navy', 'green', 'yellow', 'grey', 'pink', 'orange', 'purple', 'brown', 'tartan', 'striped'];
const VEHICLES = ['car', 'car', 'campervan', 'motorhome', 'motorbike', 'van', 'car with a trailer', 'horsebox', 'e-bike', 'tandem', 'minibus', 'electric car'];
const DAYS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];
const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
const FESTIVALS = ['Lantern Week', 'the Caddleby Regatta', 'midsummer weekend', 'Easter', 'the bank holiday', 'the Orrisfold Shanty Fair'];

// ---------------------------------------------------------------------------------------------
// Slot values. Each message gets a context so "{from}" means the same harbour all through it.

const pad2 = (n) => String(n).padStart(2, '0');
const ordinal = (n) => `${n}${n % 10 === 1 && n !== 11 ? 'st' : n % 10 === 2 && n !== 12 ? 'nd' : n % 10 === 3 && n !== 13 ? 'rd' : 'th'}`;

/** @param {Rng} r */
function makeSlots(r) {
  const minute = () => r.pick([0, 0, 0, 5, 10, 15, 15, 20, 30, 30, 35, 40, 45, 45, 50]);
  const procName = () => r.pick(SYL_A) + r.pick(SYL_B) + r.pick(SYL_C);
  const name = () => (r.chance(0.15) ? `${r.pick(FIRST_NAMES)} ${r.pick(SURNAMES)}` : r.pick(FIRST_NAMES));
  return {
    op: () => r.pick(OPERATOR),
    harbour: () => r.weighted(HARBOURS),
    ship: () => (r.chance(0.3) ? 'the ' : r.chance(0.3) ? 'MV ' : '') + r.weighted(SHIPS),
    time: () => {
      const h = r.int(6, 22);
      const m = minute();
      const h12 = ((h + 11) % 12) + 1;
      const ap = h < 12 ? 'am' : 'pm';
      return r.pick([
        `${h12} ${ap}`, `${h12}${ap}`, `${h12}:${pad2(m)}${ap}`, `${h12}.${pad2(m)} ${ap}`,
        `${pad2(h)}:${pad2(m)}`, `${h}:${pad2(m)}`, `${h12}:${pad2(m)} ${ap.toUpperCase()}`,
        m === 30 ? `half ${h12}` : `${h12} o'clock`,
      ]);
    },
    /** A past moment, relative or dated. */
    when: () => r.pick(['yesterday', 'last Friday', `on ${r.pick(DAYS)}`, 'last week', `on ${ordinal(r.int(1, 28))} ${r.pick(MONTHS)}`]),
    hhmm: () => `${pad2(r.int(6, 22))}:${pad2(minute())}`,
    mins: () => String(r.int(3, 30) * 5),
    hours: () => r.pick(['2', '3', 'two', 'three', 'four', '1.5']),
    weeks: () => r.pick(['3', '4', '5', '6', 'six', 'eight', '10']),
    n: () => String(r.int(2, 7)),
    kidAge: () => String(r.int(3, 5)),
    deck: () => String(r.int(2, 7)),
    day: () => r.pick(DAYS),
    festival: () => r.pick(FESTIVALS),
    date: () => {
      const d = r.int(1, 28);
      const mo = r.int(0, 11);
      return r.pick([
        `${d} ${MONTHS[mo]}`, `${MONTHS[mo]} ${ordinal(d)}`, `${pad2(d)}/${pad2(mo + 1)}`,
        `${r.pick(DAYS).slice(0, 3)} ${ordinal(d)}`, `the ${ordinal(d)}`, `2025-${pad2(mo + 1)}-${pad2(d)}`,
        `${pad2(d)}.${pad2(mo + 1)}.2025`, `${r.pick(DAYS)} ${d} ${MONTHS[mo].slice(0, 3)}`,
      ]);
    },
    price: () => {
      const whole = r.int(4, 180);
      const cents = r.pick(['00', '50', '20', '95', '40', '75']);
      return r.pick([
        `€${whole}.${cents}`, `£${whole}`, `€${whole}`, `£${whole}.${cents}`, `${whole},${cents} €`,
        `EUR ${whole}`, `GBP ${whole}.${cents}`, `${whole} euros`, `${whole} quid`,
      ]);
    },
    code: () => {
      const L = 'ABCDEFGHJKLMNPQRSTUVWXYZ';
      const l = () => L[r.int(0, L.length - 1)];
      const d = () => String(r.int(0, 9));
      return r.pick([
        `GH-${d()}${d()}${d()}${d()}-${l()}${l()}`, `GHF${d()}${d()}${l()}${d()}${l()}`,
        `#BK${d()}${d()}${d()}${d()}${d()}`, `gh${d()}${d()}${d()}${d()}${l().toLowerCase()}${l().toLowerCase()}`,
        `${l()}${l()}${l()}-${d()}${d()}${d()}`,
      ]);
    },
    email: () => {
      const local = r.pick([
        () => r.pick(FIRST_NAMES).toLowerCase().normalize('NFD').replace(/\p{M}/gu, '') + '.' + r.pick(SURNAMES).toLowerCase().replace('-', ''),
        () => r.pick(FIRST_NAMES).toLowerCase().normalize('NFD').replace(/\p{M}/gu, '') + '_' + r.int(1, 99),
        () => procName().toLowerCase() + r.int(10, 999),
      ])();
      return `${local}@${r.pick(['example.org', 'example.com', 'mail.example', 'post.example'])}`;
    },
    refundUrl: () => r.pick([`https://${DOMAIN}/refunds`, `${DOMAIN}/help/refunds`, `https://tickets.example.com/refund?ref=${r.int(10000, 99999)}`]),
    timetableUrl: () => r.pick([`https://www.${DOMAIN}/timetable?route=${r.int(1, 9)}`, `${DOMAIN}/timetable`, `https://${DOMAIN}/sailings/${r.pick(DAYS).toLowerCase()}`]),
    lostUrl: () => r.pick([`https://${DOMAIN}/lost-property`, `${DOMAIN}/help/lost`]),
    photoUrl: () => r.pick([`http://www.example.org/ferry-photos/${procName().toLowerCase()}`, `https://photos.example.com/${r.int(1000, 9999)}`]),
    name,
    handle: () => `@${r.pick(FIRST_NAMES).toLowerCase().normalize('NFD').replace(/\p{M}/gu, '')}${r.pick(['', '_', '.'])}${r.int(1, 999)}`,
    item: () => r.pick(ITEMS),
    colour: () => r.pick(COLOURS),
    vehicle: () => r.pick(VEHICLES),
    len: () => r.pick([`${r.int(4, 7)}.${r.int(0, 9)} m`, `${r.int(4, 8)}m`, `${r.int(4, 8)} metres`, `${r.int(14, 24)} ft`]),
    cabin: () => procName(),
    cabinNo: () => String(r.int(101, 348)),
    place: () => r.pick([
      'the café', 'the upper deck', 'the quiet lounge', `row ${r.pick(['A', 'C', 'F', 'H', 'K'])}`,
      "the kids' play area", `the ${procName()} lounge`, `the toilets on deck ${r.int(2, 6)}`,
      `seat ${r.int(1, 40)}${r.pick(['A', 'B', 'C', 'D'])}`, 'the bar', 'the outside benches at the back',
    ]),
  };
}

// Slots that keep one value for the whole message.
const STICKY = new Set(['from', 'to', 'ship', 'code', 'name', 'email', 'item', 'colour', 'vehicle', 'cabin', 'op']);

/** Per-message slot context: fills "{slot}" placeholders in templates. */
class Context {
  /** @param {Rng} r @param {ReturnType<typeof makeSlots>} slots */
  constructor(r, slots) {
    this.r = r;
    this.slots = slots;
    /** @type {Map<string, string>} */
    this.fixed = new Map();
    /** Templates already used in this message. */
    this.used = new Set();
  }
  /** A template from the pool not yet used in this message, or undefined. @param {readonly string[]} pool */
  fresh(pool) {
    const left = pool.filter((t) => !this.used.has(t));
    if (left.length === 0) return undefined;
    const t = this.r.pick(left);
    this.used.add(t);
    return t;
  }
  /** @param {string} key */
  get(key) {
    if (this.fixed.has(key)) return /** @type {string} */ (this.fixed.get(key));
    let v;
    if (key === 'from' || key === 'to') {
      const other = this.fixed.get(key === 'from' ? 'to' : 'from');
      do v = this.slots.harbour(); while (v === other);
    } else if (key === 'crossing') {
      const a = this.get('from');
      const b = this.get('to');
      v = this.r.pick([`${a} to ${b}`, `${a}–${b}`, `${a}-${b}`, `${a} > ${b}`, `${a}/${b}`]);
    } else {
      const base = key.replace(/2$/, ''); // {time2}, {price2}, {date2}: a second, fresh value
      const make = this.slots[base];
      if (!make) throw new Error(`unknown slot {${key}}`);
      v = make();
    }
    if (STICKY.has(key)) this.fixed.set(key, v);
    return v;
  }
  /** @param {string} template */
  fill(template) {
    return template.replace(/\{(\w+)\}/g, (_, k) => this.get(k));
  }
}

// ---------------------------------------------------------------------------------------------
// Templates: core sentences per topic and sentiment (neg / neu / pos).

const T = {
  delays: {
    neg: [
      'The {time} from {from} left {mins} minutes late AGAIN.',
      'Sat on {ship} for {mins} mins before we even moved, no announcement, nothing.',
      'Why is the {crossing} crossing late every single morning?',
      'Missed my train connection at {to} because the ferry was {mins} minutes behind.',
      "Third delay this week on the {time} sailing. I'm going to lose my job at this rate.",
      'No one at {from} could tell us when the boat would actually leave.',
      'The app said on time, the boat turned up at {time2}. Useless.',
      'We waited in the queue at {from} for over {hours} hours.',
      'Delayed again?? this is getting ridiculous',
      'The board said "on time" right up until it said "cancelled".',
      '{ship} broke down halfway across and we drifted for ages off {harbour}.',
      "Can't believe the {time} was cancelled with ten minutes' notice.",
      'Kids were cold and hungry, the café was shut and the delay just kept growing.',
      'Is there any compensation for a {hours} hour delay? Because there should be.',
      'Nobody answered the phone at the terminal, I tried {n} times.',
      "the {time} still hasn't left {from}, it's now {time2}",
      'Stuck at {from} with no info. Staff hiding in the office.',
      'Every day this week the {crossing} has been late, every single day.',
      "Weather was calm, so what's the excuse this time?",
      'We were told "technical issue" and then nothing for an hour.',
      "Your so-called \"minor delay\" was {mins} minutes. That's not minor.",
      'Late, late, late. Same story every Monday.',
      "I've now missed {n} hospital appointments because of your delays.",
      "It's {time2} and we're still tied up at {from}, what is going on?",
      'The {time} never even showed up, we only found out when a deckhand walked past.',
      'Ended up paying {price} for a taxi at {to} because the last bus had gone.',
    ],
    neu: [
      'Is the {time} from {from} running on time today?',
      'Any update on {ship}? The board at {to} shows delayed.',
      'How late is the {crossing} sailing expected to be?',
      'If the {time} is delayed will I still make the {time2} bus at {to}?',
      "Heard there's fog around {harbour}, are sailings affected this afternoon?",
      'Just checking whether sailings on {date} are affected by the strike notice.',
      'Can you let me know the new departure time for the {time} from {from}?',
      'Is {ship} back in service or still at the yard?',
      'Do you post delay updates anywhere other than the app?',
      'Our group of {n} is booked on the {time}, should we still turn up at check-in time if it runs late?',
      'Will the {time} wait for the connecting bus from {harbour} if that is late?',
      'Is the weather warning for {date} likely to cancel the morning crossings?',
    ],
    pos: [
      'Small delay at {from} but the crew kept us updated the whole time, thanks.',
      'Only {mins} minutes late in that wind, fair play to the captain.',
      'Appreciated the text about the delay before I left home, saved me a cold wait.',
      'Delayed, but the free tea on board made up for it 🙂',
      'Good call holding the {time} for the late bus from {harbour}, thank you.',
    ],
  },
  tickets: {
    neg: [
      "Your website won't take my card, tried {n} times.",
      'Charged twice for booking {code}!',
      'Why is a return to {to} {price} now? It used to be half that.',
      'The ticket machine at {from} ate my card and printed nothing.',
      "I can't find my e-ticket anywhere, the confirmation email never arrived.",
      'The app logs me out every time I try to pay.',
      'Booking {code} shows the wrong date, I booked {date} not {date2}.',
      "Staff at {from} wouldn't accept the QR code on my phone.",
      "The promo code from your newsletter doesn't work.",
      'Paid {price} for a reserved seat and there were no seats left.',
      'The checkout page just says "error 500" and takes my money anyway.',
      'Booking fee of {price} on top of the fare? Daylight robbery.',
      'Tried to book the {time} for {date} and the site kept timing out.',
    ],
    neu: [
      'Can I change booking {code} to the {time} sailing on {date}?',
      'Do children under {kidAge} travel free on the {crossing} route?',
      'How much is a foot passenger return from {from} to {to}?',
      'Is there a discount for students or over-65s?',
      'Can I buy tickets on board or only online?',
      'Do I need to print the ticket or is it ok on my phone?',
      'Is there a season ticket for the {crossing} crossing?',
      "I'd like to add a bike to booking {code}, how do I do that?",
      "What's the difference between the flexi fare and the saver fare?",
      'Can I pay in £ at {from} or only in €?',
      'Please can you resend the tickets for {code} to {email}',
      'Is there a family ticket for 2 adults and {n} kids?',
      "Can I book a cabin on {ship}? I can't see the option online.",
      'Does the day return to {to} have to be used on the same day?',
    ],
    pos: [
      'Booked in two minutes on the new app, much better than before.',
      'Thanks for sorting out booking {code} so quickly over the phone.',
      'The season ticket has saved me a fortune this year, {price} well spent.',
      '{name} at the {from} desk found me a cheaper fare, really helpful.',
    ],
  },
  refunds: {
    neg: [
      "Still waiting for my refund for {code}, it's been {weeks} weeks.",
      'You cancelled the sailing, I want my {price} back, not a voucher.',
      'Third email about my refund and still nothing. {email}',
      'The refund form at {refundUrl} just crashes.',
      "I paid {price} and got back less than half of it, where's the rest?",
      'Your policy says 5 working days. It has been a month.',
      'I was told on the phone the refund was approved. The bank says no money ever came.',
      'Do NOT book the flexi fare, they never refund anything.',
      'Your agent told me "refunds take up to 90 days". Ninety days?!',
      'Cancelled crossing on {date}, refund refused because I "chose not to travel". Unbelievable.',
      "You took {price} in a second but can't manage to give it back in {weeks} weeks.",
    ],
    neu: [
      'How do I request a refund for a cancelled sailing on {date}?',
      'Can I get a refund if I cancel {code} 48 hours before?',
      'Is the booking fee refundable?',
      "I've submitted a refund request for {code}, how long does it usually take?",
      'Would a credit voucher also be valid on the {crossing} route?',
      'Can the refund go to a different card? The old one has expired.',
      'Do I get a partial refund if only the outward sailing was cancelled?',
    ],
    pos: [
      'Refund for {code} arrived today, quicker than I expected, thank you!',
      'Got my {price} back within a week, no fuss. Cheers.',
      '{name} on the phone sorted my refund in five minutes, brilliant.',
    ],
  },
  'lost-property': {
    neg: [
      'Lost my {item} on {ship} and nobody at {to} seems to care.',
      "I've rung lost property {n} times, no one picks up.",
      'Someone handed in my {item}, and now you say it was thrown away??',
      'Left a {colour} {item} on the {time} and your office is closed all weekend.',
      'Lost property told me to "check back in a month". A month!',
    ],
    neu: [
      'I left a {colour} {item} on {ship} {when}, near {place}. Has it been handed in?',
      'Has anyone found a {colour} {item}? Lost it on the {crossing} crossing at {time}.',
      'My son left his {item} under a seat near {place}.',
      'What are the opening hours of the lost property office at {from}?',
      'Could you check for a {item} with a name tag saying {name}?',
      'Lost: {colour} {item}, probably on the {time} from {from}. Contact {email}',
      'Can lost items be posted to me or do I have to collect them at {to}?',
      'Think I dropped my {item} on the stairs by {place} on the {time}.',
      'Filled in the form at {lostUrl} {when}, no reply yet.',
    ],
    pos: [
      'Got my {item} back! Thank you to whoever handed it in at {to}.',
      "Massive thanks to {name} for finding my daughter's {item} on {ship}.",
      'Lost property at {from} posted my {item} back within two days, amazing.',
    ],
  },
  accessibility: {
    neg: [
      'The lift on {ship} was out of order again and I use a wheelchair.',
      'No one helped my mum down the ramp at {from}, the assistance we booked never showed up.',
      'The accessible toilet on deck {deck} was locked the whole crossing.',
      'Booked assistance for {date} and the staff had no record of it.',
      'The gangway at {to} is far too steep for a mobility scooter.',
    ],
    neu: [
      'Is there step-free access to the passenger lounge on {ship}?',
      'Can I bring my assistance dog on the {crossing} sailing?',
      'How do I book assistance for a passenger with limited mobility?',
      'Do you have hearing loops at the {from} terminal?',
      'Is there a quiet area on board for an autistic child?',
      'Are the announcements shown on screens as well, for deaf passengers?',
      "Can I stay in my car on the vehicle deck if I can't manage the stairs?",
    ],
    pos: [
      'The crew helped my dad with his wheelchair all the way to the lounge, so kind.',
      'Assistance at {from} was brilliant, they were waiting for us at the door.',
      'Thank you for the new ramp at {to}, it makes a real difference.',
    ],
  },
  timetable: {
    neg: [
      'Why did you cut the {time} sailing? Half the island relies on it.',
      'The new winter timetable makes it impossible to commute from {from}.',
      "Your printed timetable and the website don't match.",
      'Only two sailings on Sundays now? Seriously?',
      'The last boat back from {to} is at {time} now, so no more evenings out.',
    ],
    neu: [
      'When does the summer timetable start?',
      'What time is the first sailing from {from} on {day}?',
      'Is there a late sailing from {to} on Friday nights?',
      'Are there extra sailings over {festival}?',
      'How long does the {crossing} crossing take?',
      'Is the {time} running on bank holidays?',
      'Where can I find the timetable for {date}? The link at {timetableUrl} is broken.',
      'Does {ship} still do the {crossing} run on {day}s?',
      "What's the last sailing from {from} on {date}?",
      'Is there a connection from {to} on to {harbour} the same day?',
      'Do the {time} and the {time2} both stop at {harbour}?',
    ],
    pos: [
      'Love the extra evening sailing to {to}, thank you.',
      'The new timetable finally lines up with the trains at {from}, great job.',
    ],
  },
  vehicles: {
    neg: [
      "Charged the van rate for a normal car, it's {len} long!",
      'Someone dented my car on the vehicle deck and the crew shrugged.',
      "A car alarm went off for the whole crossing, please tell people to switch them off",
      'Waited {hours} hours in the vehicle queue at {from} while foot passengers walked straight on.',
      'Told at check-in there was no space for my {vehicle} even though I had booking {code}.',
      'Paid {price} extra for a {vehicle} that is barely bigger than a car.',
    ],
    neu: [
      "Can I take a {vehicle} on the {crossing} sailing? It's about {len} long.",
      'Is there charging for electric cars on board?',
      'How early do vehicles need to check in at {from}?',
      'Do I need to book a space for a {vehicle} or can I just turn up?',
      "What's the height limit for the upper car deck on {ship}?",
      'Can I carry a gas bottle in a campervan?',
      'Does a roof box count towards the vehicle height?',
      'Can passengers stay with their {vehicle} during the crossing?',
    ],
    pos: [
      'Loading the cars was so quick this morning, well organised.',
      'Crew guided my {vehicle} on with inches to spare, fantastic job.',
    ],
  },
  praise: {
    neg: [
      'Great crew, shame about the prices though.',
      'Crew were lovely but the café ran out of food by {time}.',
    ],
    neu: [
      'Is there a way to leave feedback for a crew member?',
      'Who do I write to about a member of staff who went above and beyond?',
    ],
    pos: [
      'Lovely crossing to {to} this morning, calm sea and friendly crew.',
      'Shout out to {name} in the café on {ship}, made our day!',
      "Best fish soup I've had in years, on a ferry of all places.",
      'Saw dolphins off {harbour}!! Thank you captain for slowing down 🐬',
      'The new {cabin} lounge is gorgeous.',
      "Been using the {crossing} route for 20 years, it's never let me down.",
      'Kids loved the bridge tour, thank you so much.',
      'Spotless toilets, hot coffee, on time. What more could you want?',
      'Sunset from the top deck on the {time} back from {to}... stunning.',
      'Cabin {cabinNo} on {ship} was spotless and so comfy, slept like a baby.',
      '{name} on the car deck was so patient with my nervous driving, thank you!',
    ],
  },
};

// Very short messages (fragments) per topic and sentiment.
const FRAGMENTS = {
  delays: { neg: ['late again 🙄', "where's the boat??", 'seriously?? again', 'delayed. AGAIN.'], neu: ['any update?', 'on time today?'], pos: ['made it, thx crew'] },
  tickets: { neg: ['app down again'], neu: ['how much for a bike?', 'cheapest fare to {to}?'], pos: ['booked!'] },
  refunds: { neg: ['refund???', 'where is my money'], neu: ['refund status {code}?'], pos: ['refund received, thanks'] },
  'lost-property': { neg: ['nobody answers lost property'], neu: ['lost my {item} on the {time}', 'found a {item}?'], pos: ['found it!! thank you'] },
  accessibility: { neg: ['lift broken again'], neu: ['wheelchair space on {ship}?'], pos: ['thanks for the help with the ramp'] },
  timetable: { neg: ['bring back the {time}!'], neu: ['first boat {day}?', 'timetable for {festival}?'], pos: ['love the new late boat'] },
  vehicles: { neg: ['car deck chaos'], neu: ['ev charging on board?'], pos: ['smoothest loading ever'] },
  praise: { neg: ['nice crew, awful coffee'], neu: ['feedback form?'], pos: ['love this ferry ❤️', 'best crew on the Sound', '10/10 crossing today'] },
};

// Sentences that fit any topic: details, and the filler of longer letters.
const DETAILS = [
  'My booking ref is {code}.', 'We were on the {time} from {from} {when}.', 'I paid {price} for {n} adults and a car.',
  'You can reach me at {email}.', 'Booking reference: {code}', 'That was {ship}, sailing {crossing}.',
  'I travel this route most weeks.', 'There were {n} of us, plus the dog.', 'Photos here: {photoUrl}',
];
const STORY = [
  "We'd planned this trip for months.", 'My partner has a bad back so the stairs were a nightmare.',
  "The sea was rough but that's not your fault.", 'We finally got to {to} at {time2}, tired and soaked.',
  'The lady at the desk in {from} was doing her best, to be fair.',
  "I had to ring my boss from the queue to say I'd be late, again.",
  'We had a dog, two kids and a roof box full of camping gear.',
  "I've travelled with {op} for years and this is the first time I've written in.",
  'It was {date}, the {time} sailing on {ship}.', 'On the way back things were no better.',
  'My elderly father was with us, which made it all harder.',
  'The café on board only had crisps left.', 'Nobody made a single announcement.',
  'Honestly, the crew on board were lovely.', 'The view coming into {to} almost made up for it.',
  'I know the weather around {harbour} can be wild.', 'We sat in {place} most of the way.',
  'Another passenger, {name}, had the same problem.', 'I took photos of the departure board at {time2}.',
  'Our cabin was the {cabin}, number {cabinNo}.', 'I asked {n} different people and got {n2} different answers.',
  'The man at the gate said "nothing I can do, mate".', 'By then it was dark and raining.',
  'My daughter was sick twice on the way over.', 'To be clear, this is not the first time.',
  'I have kept all the receipts.', 'I am copying this to {email} as well.',
];

const OPENERS = [
  'Hi,', 'Hello', 'Hi there,', 'Good morning,', 'Dear {op},', 'Hey {op}', `${HANDLE}`, 'To whom it may concern,',
  'Quick question:', 'Hiya', 'Evening all,', 'Morning!', 'Hello team,', 'Hi {op} team,',
];
const CLOSERS = {
  neg: ['Not good enough.', 'Sort it out.', 'Really disappointed.', 'Absolute joke.', 'Expect better from you.', 'I want a reply this time.', 'Shambles.', 'Never again.'],
  neu: ['Thanks in advance.', 'Thanks!', 'Cheers', 'Many thanks.', 'Any help appreciated.', 'Thank you.', 'TIA'],
  pos: ['Thanks again!', 'Keep it up!', 'See you next summer.', 'Will definitely travel with you again.', 'Cheers, crew!', 'You made our holiday.'],
};
const SIGNOFFS = ['– {name}', 'Regards, {name}', 'Thanks, {name} ({email})', 'Sent from my phone', '{name}, cabin {cabinNo}', '{name}', 'Kind regards,\n{name}'];

const EMOJI = {
  neg: ['😡', '🙄', '😤', '😢', '🤦‍♀️', '👎', '😠', '💸'],
  neu: ['🤔', '⛴️', '🙏', '🚢'],
  pos: ['😊', '👍', '❤️', '🌊', '☀️', '🐬', '⛴️', '🙌', '😍'],
};
const HASHTAGS = {
  neg: ['#delayedagain', '#ferryfail', '#notgoodenough', '#stuckatsea'],
  neu: ['#ferry', '#OstrelSound', '#travel'],
  pos: ['#islandlife', '#ferrylife', '#glimmerholt', '#calmseas', '#OstrelSound'],
};

// Common misspellings and chat spellings (applied to "sloppy" messages).
const MISSPELL = {
  received: 'recieved', definitely: 'definately', tomorrow: 'tommorow', until: 'untill', which: 'wich',
  because: 'becuase', separate: 'seperate', ferry: 'ferrie', refund: 'refnud', ticket: 'tikcet',
  cancelled: 'canceled', again: 'agian', luggage: 'lugage', wheelchair: 'wheelchiar', timetable: 'timtable',
  you: 'u', please: 'pls', thanks: 'thx', "can't": 'cant', "won't": 'wont', "it's": 'its', "don't": 'dont',
  really: 'realy', arrived: 'arived', across: 'accross', their: 'there', minutes: 'mins',
};

// ---------------------------------------------------------------------------------------------
// Messages in other languages: [language, topic, sentiment, text]. Short, simple sentences.

const FOREIGN = [
  ['fr', 'delays', 'neg', 'Le ferry de {hhmm} pour {to} est encore en retard !'],
  ['fr', 'delays', 'neg', "Nous avons attendu plus d'une heure à {from}, sans aucune information."],
  ['fr', 'delays', 'neu', "Est-ce que le bateau de {hhmm} part à l'heure aujourd'hui ?"],
  ['fr', 'tickets', 'neu', 'Je voudrais changer ma réservation {code} pour samedi.'],
  ['fr', 'tickets', 'neg', 'Le site refuse ma carte bancaire depuis ce matin.'],
  ['fr', 'refunds', 'neg', "J'attends toujours mon remboursement pour la réservation {code}."],
  ['fr', 'refunds', 'neu', 'Comment puis-je demander un remboursement ?'],
  ['fr', 'lost-property', 'neu', "J'ai oublié mon sac à dos sur le bateau hier soir."],
  ['fr', 'accessibility', 'neu', 'Y a-t-il un ascenseur pour les fauteuils roulants ?'],
  ['fr', 'timetable', 'neu', "Où puis-je trouver les horaires d'hiver ?"],
  ['fr', 'vehicles', 'neu', 'Est-ce que je peux embarquer avec un camping-car ?'],
  ['fr', 'praise', 'pos', "Merci beaucoup à l'équipage, la traversée était très agréable !"],
  ['fr', 'praise', 'pos', 'Un grand merci, tout était parfait.'],
  ['de', 'delays', 'neg', 'Die Fähre nach {to} hat schon wieder Verspätung.'],
  ['de', 'delays', 'neg', 'Wir haben über eine Stunde in {from} gewartet, ohne jede Information.'],
  ['de', 'delays', 'neu', 'Fährt das Schiff um {hhmm} heute pünktlich?'],
  ['de', 'tickets', 'neu', 'Kann ich meine Buchung {code} auf Samstag ändern?'],
  ['de', 'tickets', 'neg', 'Der Fahrkartenautomat am Hafen funktioniert nicht.'],
  ['de', 'refunds', 'neg', 'Ich warte immer noch auf meine Rückerstattung für {code}.'],
  ['de', 'refunds', 'neu', 'Wie kann ich eine Rückerstattung beantragen?'],
  ['de', 'lost-property', 'neu', 'Ich habe meine Jacke auf der Fähre vergessen.'],
  ['de', 'accessibility', 'neu', 'Gibt es einen Aufzug für Rollstuhlfahrer?'],
  ['de', 'timetable', 'neu', 'Wann fährt die erste Fähre am Sonntag?'],
  ['de', 'vehicles', 'neu', 'Darf ich mit einem Wohnmobil mitfahren?'],
  ['de', 'praise', 'pos', 'Vielen Dank an die Crew, die Überfahrt war wunderbar!'],
  ['de', 'praise', 'pos', 'Alles war perfekt, danke schön.'],
  ['es', 'delays', 'neg', 'El ferry de las {hhmm} salió con una hora de retraso.'],
  ['es', 'delays', 'neg', '¡Otra vez tarde! Es la tercera vez esta semana.'],
  ['es', 'delays', 'neu', '¿El barco de las {hhmm} sale a su hora hoy?'],
  ['es', 'tickets', 'neu', '¿Puedo cambiar mi reserva {code} para el sábado?'],
  ['es', 'tickets', 'neg', 'No puedo comprar el billete en la página web.'],
  ['es', 'refunds', 'neg', 'Todavía espero el reembolso de la reserva {code}.'],
  ['es', 'refunds', 'neu', '¿Cómo puedo pedir un reembolso?'],
  ['es', 'lost-property', 'neu', 'Perdí mi cartera en el barco, ¿alguien la encontró?'],
  ['es', 'accessibility', 'neu', '¿Hay acceso para sillas de ruedas en la cubierta superior?'],
  ['es', 'timetable', 'neu', '¿Cuál es el horario del domingo?'],
  ['es', 'vehicles', 'neu', '¿Puedo llevar mi coche en el ferry de la mañana?'],
  ['es', 'praise', 'pos', '¡Muchas gracias a la tripulación! Todo fue perfecto.'],
  ['it', 'delays', 'neg', 'Il traghetto è di nuovo in ritardo.'],
  ['it', 'lost-property', 'neu', 'Ho perso il mio ombrello sul traghetto.'],
  ['it', 'timetable', 'neu', 'A che ora parte il primo traghetto domenica?'],
  ['it', 'praise', 'pos', 'Grazie mille, il personale è stato gentilissimo!'],
  ['pt', 'praise', 'pos', 'Obrigado pela viagem, foi ótima!'],
  ['ru', 'delays', 'neg', 'Паром опять опаздывает.'],
  ['ru', 'lost-property', 'neu', 'Я потерял телефон на пароме.'],
  ['ru', 'praise', 'pos', 'Спасибо за отличную поездку!'],
  ['ru', 'tickets', 'neu', 'Где можно купить билет?'],
  ['ru', 'refunds', 'neg', 'Я до сих пор жду возврата денег за билет.'],
  ['ru', 'timetable', 'neu', 'Есть ли расписание на воскресенье?'],
  ['el', 'delays', 'neg', 'Το πλοίο έχει πάλι καθυστέρηση.'],
  ['el', 'praise', 'pos', 'Ευχαριστώ πολύ για το ταξίδι!'],
  ['el', 'lost-property', 'neu', 'Έχασα την τσάντα μου στο πλοίο.'],
  ['el', 'tickets', 'neu', 'Πού μπορώ να αγοράσω εισιτήριο;'],
  ['ja', 'delays', 'neg', 'フェリーがまた遅れています。'],
  ['ja', 'lost-property', 'neu', '船の中で財布をなくしました。'],
  ['ja', 'praise', 'pos', 'ありがとうございました！とても楽しかったです。'],
  ['ja', 'tickets', 'neu', '切符はどこで買えますか？'],
  ['ja', 'accessibility', 'neu', '車いすで乗れますか？'],
  ['ja', 'timetable', 'neu', '日曜日の時刻表はありますか？'],
  ['zh', 'delays', 'neg', '渡轮又晚点了。'],
  ['zh', 'lost-property', 'neu', '我在船上丢了手机。'],
  ['zh', 'praise', 'pos', '谢谢船员们，服务很好！'],
  ['zh', 'refunds', 'neu', '我想申请退款。'],
  ['zh', 'timetable', 'neu', '周日的时刻表在哪里？'],
  ['zh', 'vehicles', 'neu', '可以带汽车上船吗？'],
];
const GREETINGS = {
  fr: 'Bonjour !', de: 'Hallo!', es: '¡Hola!', it: 'Ciao!', pt: 'Olá!', ru: 'Здравствуйте!', el: 'Γεια σας!', ja: 'こんにちは。', zh: '你好！',
};
const NO_SPACE_LANGS = new Set(['ja', 'zh']);

// ---------------------------------------------------------------------------------------------
// Labels and how they are drawn.

const TOPICS = [
  ['delays', 0.25], ['tickets', 0.18], ['refunds', 0.14], ['timetable', 0.12],
  ['praise', 0.09], ['vehicles', 0.09], ['lost-property', 0.08], ['accessibility', 0.05],
];
/** P(sentiment | topic), as neg / neu / pos weights. */
const SENTIMENT = {
  delays: [0.8, 0.17, 0.03], tickets: [0.4, 0.5, 0.1], refunds: [0.65, 0.3, 0.05], timetable: [0.2, 0.72, 0.08],
  vehicles: [0.35, 0.55, 0.1], 'lost-property': [0.3, 0.55, 0.15], accessibility: [0.45, 0.4, 0.15], praise: [0.02, 0.06, 0.92],
};
const SENTIMENT_LABEL = { neg: 'negative', neu: 'neutral', pos: 'positive' };

// ---------------------------------------------------------------------------------------------
// Noise: typos, case, emphasis.

/** Misspell a few words of an English message. @param {Rng} r @param {string} text */
function addTypos(r, text) {
  // Work chunk by chunk (split on white space, which is kept); leave addresses, codes and tags alone.
  return text.split(/(\s+)/).map((chunk) => {
    if (/[@/\d#]|\w\.\w/.test(chunk)) return chunk;
    return chunk.replace(/[\p{L}']+/gu, (word) => {
      const lower = word.toLowerCase();
      const wrong = MISSPELL[lower];
      if (wrong && r.chance(0.35)) {
        const capital = word[0] !== lower[0]; // keep a leading capital: "Because" -> "Becuase"
        return capital ? wrong[0].toUpperCase() + wrong.slice(1) : wrong;
      }
      if (word.length < 4 || !/^[A-Za-z]+$/.test(word) || !r.chance(0.025)) return word;
      const i = r.int(1, word.length - 2);
      switch (r.int(0, 2)) {
        case 0: return word.slice(0, i) + word[i + 1] + word[i] + word.slice(i + 2); // swap two letters
        case 1: return word.slice(0, i) + word.slice(i + 1); // drop one
        default: return word.slice(0, i) + word[i] + word.slice(i); // double one
      }
    });
  }).join('');
}

/** Upper-case one longish word (not inside addresses). @param {Rng} r @param {string} text */
function shoutOneWord(r, text) {
  const words = [...text.matchAll(/(?<![@\w./#-])[a-z]{5,}(?![\w@.-]*@)/g)];
  if (words.length === 0) return text;
  const m = r.pick(words);
  return text.slice(0, m.index) + m[0].toUpperCase() + text.slice(m.index + m[0].length);
}

// ---------------------------------------------------------------------------------------------
// Message composition.

/** @param {Rng} r @returns {{ text: string, topic: string, sentiment: string }} */
function makeMessage(r) {
  const slots = makeSlots(r);
  const ctx = new Context(r, slots);
  if (r.chance(0.08)) return makeForeign(r, ctx);

  const topic = r.weighted(TOPICS);
  const [wn, wu, wp] = SENTIMENT[topic];
  const s = r.weighted([['neg', wn], ['neu', wu], ['pos', wp]]);
  // A core sentence; strong feelings sometimes get extra punctuation.
  const core = () => {
    const t = ctx.fresh(T[topic][s]) ?? ctx.fresh(STORY) ?? r.pick(T[topic][s]);
    const c = ctx.fill(t);
    return s !== 'neu' && r.chance(0.12) ? c.replace(/[.!]?$/, r.pick(s === 'neg' ? ['!!', '!!!', '!!!!', '?!'] : ['!', '!!', '!!!'])) : c;
  };

  /** @type {string[]} sentences, joined by spaces (or the odd line break) */
  const parts = [];
  const mode = r.weighted([['fragment', 0.04], ['short', 0.52], ['medium', 0.39], ['long', 0.045], ['epic', 0.005]]);
  if (mode === 'fragment') {
    parts.push(ctx.fill(r.pick(FRAGMENTS[topic][s])));
  } else {
    const opener = r.chance(mode === 'short' ? 0.25 : 0.5);
    if (opener) parts.push(ctx.fill(r.pick(OPENERS)));
    if (mode === 'short') {
      parts.push(core());
      if (r.chance(0.12)) parts.push(ctx.fill(ctx.fresh(DETAILS) ?? ''));
    } else if (mode === 'medium') {
      const n = r.int(2, 3);
      for (let i = 0; i < n; i++) parts.push(r.chance(0.25) ? ctx.fill(ctx.fresh(DETAILS) ?? '') : core());
    } else {
      const n = mode === 'long' ? r.int(7, 13) : r.int(20, 32);
      for (let i = 0; i < n; i++) {
        const kind = r.weighted([['core', 0.4], ['story', 0.45], ['detail', 0.15]]);
        parts.push(kind === 'core' ? core() : ctx.fill(ctx.fresh(kind === 'story' ? STORY : DETAILS) ?? ctx.fresh(STORY) ?? ''));
      }
    }
    if (r.chance(mode === 'short' ? 0.3 : 0.55)) parts.push(r.pick(CLOSERS[s]));
    if (mode !== 'short' && r.chance(0.3)) parts.push(ctx.fill(r.pick(SIGNOFFS)));
  }

  // Drop empty parts and exact repeats.
  const unique = parts.filter((p, i) => p !== '' && parts.indexOf(p) === i);
  // Join: mostly spaces; sometimes a line break, which CSV must quote.
  let text = unique[0] ?? '';
  for (const p of unique.slice(1)) text += r.chance(mode === 'long' || mode === 'epic' ? 0.12 : 0.03) ? r.pick(['\n', '\n\n']) + p : ' ' + p;

  // English grammar: "a e-bike" -> "an e-bike".
  text = text.replace(/\b([Aa]) (?=[aeiou])/g, '$1n ');

  // Noise.
  const sloppy = r.chance(0.3);
  if (sloppy) text = addTypos(r, text);
  if (sloppy && r.chance(0.35)) text = text.toLowerCase();
  if (s === 'neg' && r.chance(0.2)) text = shoutOneWord(r, text);
  if (s === 'neg' && mode !== 'epic' && r.chance(0.025)) text = text.toUpperCase();
  if (sloppy && r.chance(0.25)) text = text.replace(/[.]$/, '');
  if (r.chance(s === 'neu' ? 0.05 : 0.22)) text += (r.chance(0.7) ? ' ' : '') + r.pick(EMOJI[s]) + (r.chance(0.3) ? r.pick(EMOJI[s]) : '');
  if (r.chance(0.07)) text += ' ' + r.pick(HASHTAGS[s]) + (r.chance(0.3) ? ' ' + r.pick(HASHTAGS[s]) : '');
  if (r.chance(0.05)) text = `${r.chance(0.6) ? HANDLE : slots.handle()} ${text}`;
  if (r.chance(0.01)) text = `  ${text} `; // stray white space at the ends

  return { text, topic, sentiment: SENTIMENT_LABEL[s] };
}

/** A message in another language, sometimes with a little English mixed in. @param {Rng} r @param {Context} ctx */
function makeForeign(r, ctx) {
  const topic = r.weighted(TOPICS);
  const pool = FOREIGN.filter((f) => f[1] === topic);
  const [lang, fTopic, s, tpl] = r.pick(pool.length > 0 ? pool : FOREIGN);
  const same = FOREIGN.filter((f) => f[0] === lang && f[1] === topic && f[3] !== tpl && f[2] === s);
  const sep = NO_SPACE_LANGS.has(lang) ? '' : ' ';
  const parts = [];
  if (r.chance(0.35)) parts.push(GREETINGS[lang]);
  parts.push(ctx.fill(tpl));
  if (same.length > 0 && r.chance(0.4)) parts.push(ctx.fill(r.pick(same)[3]));
  let text = parts.join(sep);
  if (r.chance(0.2)) text += ' ' + ctx.fill(r.pick(['Booking ref {code}.', 'Thanks', '({ship}, {crossing})', '{email}']));
  if (r.chance(0.15)) text += ' ' + r.pick(EMOJI[s]);
  return { text, topic: fTopic, sentiment: SENTIMENT_LABEL[s] };
}

// ---------------------------------------------------------------------------------------------
// Writers.

/** RFC 4180 field: quoted when it holds a comma, quote, CR or LF; inner quotes doubled. */
const csvField = (v) => (/[",\r\n]/.test(v) || v !== v.trim() ? `"${v.replace(/"/g, '""')}"` : v);

/** @param {number} seed @param {number} count */
function makeMany(seed, count) {
  const r = new Rng(seed);
  return Array.from({ length: count }, () => makeMessage(r));
}

function main() {
  // CSV: the main corpus.
  const docs = makeMany(20240611, CSV_DOCS);
  const width = String(CSV_DOCS).length;
  const lines = ['id,text,topic,sentiment'];
  docs.forEach((d, i) => {
    lines.push([`m${String(i + 1).padStart(width, '0')}`, d.text, d.topic, d.sentiment].map(csvField).join(','));
  });
  writeFileSync(join(OUT_DIR, 'ferry-messages.csv'), lines.join('\n') + '\n');

  // JSONL: a second, smaller stream of messages.
  const jsonl = makeMany(777001, JSONL_DOCS).map((d) => JSON.stringify({ text: d.text, topic: d.topic }));
  writeFileSync(join(OUT_DIR, 'ferry-messages.jsonl'), jsonl.join('\n') + '\n');

  // Folder: one message a file, label = first folder. Rebuilt from scratch each run.
  const folder = join(OUT_DIR, 'ferry-folder');
  rmSync(folder, { recursive: true, force: true });
  makeMany(31337, FOLDER_DOCS).forEach((d, i) => {
    const dir = join(folder, d.topic);
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, `f${String(i + 1).padStart(3, '0')}.txt`), d.text + '\n');
  });

  console.log(`wrote ${docs.length} csv rows, ${jsonl.length} jsonl lines, ${FOLDER_DOCS} folder files to ${OUT_DIR}`);
}

main();
