/**
 * Citations for every published figure the clinical computations use, written once so the UI, the API and
 * the tests quote the same words. Where a title was not retrieved we cite the journal reference and say so,
 * rather than writing a title from memory (see shared/notes/clinical-sources.md).
 */
export const sources = {
  ryan1991:
    'Ryan JB, Wheeler JH, Hopkinson WJ, Arciero RA, Kolakowski KR. Quadriceps contusions: West Point update. Am J Sports Med 1991;19(3):299–304',
  jacksonFeagin1973:
    'Jackson DW, Feagin JA. Quadriceps contusions in young athletes. J Bone Joint Surg Am 1973;55(1):95–105 (volume and pages from memory; read in a secondary source)',
  kannus2000:
    'Kannus P. Immobilization or early mobilization after an acute soft-tissue injury? Phys Sportsmed 2000;28(3)',
  myositisPhysSportsmed1995: 'Phys Sportsmed 1995;23(2):77–82 (authors and title not retrieved)',
  bleakley2006:
    'Bleakley CM, McDonough SM, MacAuley DC. Br J Sports Med 2006;40:700–705 (title not retrieved)',
  otte2002:
    'Otte JW, Merrick MA, Ingersoll CD, Cordova ML. Subcutaneous adipose tissue thickness alters cooling time during cryotherapy. Arch Phys Med Rehabil 2002;83:1501–1505',
  moeller1997: 'Moeller JL, Monroe J, McKeag DB. Clin J Sport Med 1997;7(3):212–216 (title not retrieved)',
  collins1986: 'Collins K et al. Phys Sportsmed 1986;14(5):105–108 (title not retrieved)',
  nhsInformPrice: 'NHS inform (NHS Scotland), PRICE guidance for sprains and strains',
  farrar2001:
    'Farrar JT, Young JP, LaMoreaux L, Werth JL, Poole RM. Pain 2001;94(2):149–158 (title not retrieved)',
  commonPractice: 'common practice (no published source)',
  clinicSetting: "the clinic's setting (a default of ours, not a published figure)",
} as const;

export type SourceKey = keyof typeof sources;
