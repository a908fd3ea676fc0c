// Loads the demo plant once (filled in by the line register work).
console.log('[linewright] demo plant: nothing to load yet');
