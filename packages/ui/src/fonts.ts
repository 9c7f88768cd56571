// Source Sans 3 is shipped with the app (the files land in dist); no font CDN.
import '@fontsource/source-sans-3/400.css';
import '@fontsource/source-sans-3/600.css';
import '@fontsource/source-sans-3/700.css';
