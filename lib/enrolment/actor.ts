/** The signed-in admin on whose behalf enrolment runs; every change is confined to their school. */
export type Actor = { id: string; schoolId: string; name: string };
