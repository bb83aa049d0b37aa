// What each column of the board means, in plain words: its header's tooltip (hover and focus).
export const columnHints: Record<string, string> = {
  select: 'Tick series to compare them on one chart or to group them into a theme.',
  term: 'The search term or your own item, and where its figures come from: search interest or your sales.',
  heat: 'Out of 100, how good a bet it is to build for the target, starting now: made of rise, season lift, lead room and sales pull. Series with too little history have no heat yet and come last.',
  verdict: 'What the figures say in a word: rising, fading, steady, seasonal, a spike, or not enough history yet. Point at a verdict to read why.',
  spark: 'The last two years as a line; the dashed line is the same weeks a year earlier.',
  rise: 'How much it grows or shrinks in a year once its usual season is taken out: the figure the verdict is decided on. Shown only when the trend is clear rather than chance.',
  strength: 'From 0 to 1, how much of the ups and downs follow the same yearly pattern; 0.6 or more reads as seasonal.',
  nextPeak: 'When its usual busiest week or month comes round next.',
  region: 'The region the search figures are for, when the file said.',
  covered: 'The first and last dates of its figures.',
};

/** The themes table above the board. */
export const themeColumnHints: Record<string, string> = {
  theme: 'A group of series and items you may build a line around.',
  status: 'Where the theme stands: idea, shortlisted, picked, building, launched or retired.',
  target: 'What the theme is picked for; without a pick each series is scored for its own next peak.',
  heat: 'The heat of its series together, and how many of them count: series with too little history do not.',
  verdict: 'The verdict most of its counted series share.',
};
