package org.tufa.analysis.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;

import org.junit.jupiter.api.Test;

/** Escaping as the HTML Living Standard requires for text and quoted attribute values (section 13.1, "Writing"). */
class HtmlTest {

    @Test
    void escapesTheFiveSpecialCharacters() {
        assertEquals("FCU &lt;1&gt; &amp; &quot;A&quot; &#39;b&#39;", Html.esc("FCU <1> & \"A\" 'b'"));
        assertEquals("&amp;amp;", Html.esc("&amp;"), "an entity in the input is text, not markup");
        assertEquals("&lt;/script&gt;&lt;script&gt;", Html.esc("</script><script>"));
    }

    @Test
    void plainTextPassesThroughUnchanged() {
        String plain = "FCU-01 zone temperature 22 \u00b0C";
        assertSame(plain, Html.esc(plain));
        assertEquals("", Html.esc(null));
    }

    @Test
    void figuresAreRoundedWithAPointWhateverTheLocale() {
        java.util.Locale before = java.util.Locale.getDefault();
        try {
            java.util.Locale.setDefault(java.util.Locale.GERMANY);
            assertEquals("12.35", Html.fixed(12.345678, 2));
            assertEquals("", Html.fixed(Double.NaN, 1));
        } finally {
            java.util.Locale.setDefault(before);
        }
    }
}
