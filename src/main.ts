// The page's entry: defines the elements; index.html holds <baryon-audit-app>.
import './ui/baryon-audit-app.js';
