// The invented people of the demo scenario. No import here: scripts print this list too.
type SiteRole = 'member' | 'admin'

export const DEMO_PASSWORD = 'scholium-demo'

export const DEMO_PEOPLE = {
  admin: { email: 'wren.halloway@scholium.example', displayName: 'Wren Halloway', siteRole: 'admin' as SiteRole, role: 'site administrator' },
  author: { email: 'ysolde.quarry@ledgerfield.example', displayName: 'Ysolde Quarry', siteRole: 'member' as SiteRole, role: 'author' },
  coauthor: { email: 'tobiah.lindqvist-marsh@ledgerfield.example', displayName: 'Tobiah Lindqvist-Marsh', siteRole: 'member' as SiteRole, role: 'coauthor' },
  soloAuthor: { email: 'petra.ambrose-kettle@brackwater.example', displayName: 'Petra Ambrose-Kettle', siteRole: 'member' as SiteRole, role: 'author' },
  editor: { email: 'marguerite.ostrander-vale@ledgerfield.example', displayName: 'Marguerite Ostrander-Vale', siteRole: 'member' as SiteRole, role: 'editor' },
  otherEditor: { email: 'anselm.ravensworth-ode@brackwater.example', displayName: 'Anselm Ravensworth-Ode', siteRole: 'member' as SiteRole, role: 'editor (other venue)' },
  referee: { email: 'casimir.oyelaran-brandt@fenwick.example', displayName: 'Casimir Oyelaran-Brandt', siteRole: 'member' as SiteRole, role: 'referee' },
} as const
