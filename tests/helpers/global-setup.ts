// Replaced by the database set-up (issue 2); engine tests need nothing here.
export default async function setup() {}
