import { useLayoutEffect } from 'react';

/**
 * Add a style sheet to the document through the CSS object model while the component is mounted
 * (the app's Content-Security-Policy allows no inline <style>). A layout effect, so the rules are in
 * place before the print dialog opens.
 */
export function useAdoptedCss(css: string): void {
  useLayoutEffect(() => {
    if (css === '' || typeof CSSStyleSheet === 'undefined' || !('adoptedStyleSheets' in document)) return undefined;
    const sheet = new CSSStyleSheet();
    sheet.replaceSync(css);
    document.adoptedStyleSheets = [...document.adoptedStyleSheets, sheet];
    return () => { document.adoptedStyleSheets = document.adoptedStyleSheets.filter((s) => s !== sheet); };
  }, [css]);
}
