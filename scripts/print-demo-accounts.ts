// Prints the demo accounts after `npm start` has seeded them.
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../server/services/demo-people'

const url = process.argv[2] ?? 'http://127.0.0.1:3000'
console.log(`\nScholium is running at ${url}\nDemo accounts (password for all: ${DEMO_PASSWORD}):`)
for (const person of Object.values(DEMO_PEOPLE)) {
  console.log(`  ${person.role.padEnd(22)} ${person.displayName.padEnd(28)} ${person.email}`)
}
console.log('')
