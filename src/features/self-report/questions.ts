/**
 * How the patient page asks for each total, in our own plain words. Only totals are asked for: never the items,
 * instructions or answer wording of a questionnaire.
 */
export type QuestionWords = { question: string; hint: string; low?: string; high?: string };

const FROM_PAPER =
  'Only if your clinic gave you this questionnaire: enter the total it gives. Leave it empty otherwise.';

export const QUESTION_WORDS: Record<string, QuestionWords> = {
  'nprs-first-step': {
    question: 'How much did your heel hurt with your first steps this morning?',
    hint: 'Choose one number.',
    low: '0 = no pain at all',
    high: '10 = as bad as it could be',
  },
  'nprs-usual': {
    question: 'Over the past week, how much has your heel usually hurt?',
    hint: 'Choose one number.',
    low: '0 = no pain at all',
    high: '10 = as bad as it could be',
  },
  groc: {
    question: 'Compared with when your care started, how is your heel now?',
    hint: 'Choose one number.',
    low: '−7 = far worse',
    high: '+7 = far better (0 = about the same)',
  },
  'faam-adl': { question: 'Your total on the everyday foot and ankle questionnaire (0 to 100)', hint: FROM_PAPER },
  lefs: { question: 'Your total on the leg function questionnaire (0 to 80)', hint: FROM_PAPER },
  psfs: {
    question: 'Your own activities: the average of your ratings (0 to 10)',
    hint: 'Rate how well you can now do each activity you chose with your clinician, higher is better, then enter the average.',
  },
};

export const STEPS_WORDS: QuestionWords = {
  question: 'About how many steps a day did you walk in the past week?',
  hint: 'From a phone or watch, if you have one. Leave it empty if you do not know.',
};

/** A signed number as people write it on a scale: +3, 0, −2 (true minus sign). */
export const signed = (v: number, min: number) => (min < 0 && v > 0 ? `+${v}` : v < 0 ? `−${-v}` : String(v));
