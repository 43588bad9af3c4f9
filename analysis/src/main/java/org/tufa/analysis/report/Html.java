package org.tufa.analysis.report;

import java.util.Locale;
import org.tufa.analysis.fleet.FleetReport;

/**
 * The report's own small HTML template: text escaping, one page skeleton with inline style and script (the files
 * open offline, without network, CDN or external files), and the caution every page carries.
 */
final class Html {

    private Html() {
    }

    /**
     * Text or attribute value with the five characters that can break HTML escaped ({@code & < > " '}); other
     * characters pass through (pages are UTF-8). Null becomes empty.
     */
    static String esc(String s) {
        if (s == null) {
            return "";
        }
        StringBuilder b = null;
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            String r = switch (c) {
                case '&' -> "&amp;";
                case '<' -> "&lt;";
                case '>' -> "&gt;";
                case '"' -> "&quot;";
                case '\'' -> "&#39;";
                default -> null;
            };
            if (r != null && b == null) {
                b = new StringBuilder(s.length() + 16).append(s, 0, i);
            }
            if (b != null) {
                if (r != null) {
                    b.append(r);
                } else {
                    b.append(c);
                }
            }
        }
        return b == null ? s : b.toString();
    }

    /** Shifts from normal, one per line, escaped. */
    static String shifts(java.util.List<org.tufa.analysis.findings.Shift> shifts) {
        return String.join("<br>", shifts.stream().map(s -> esc(s.describe())).toList());
    }

    /** A rounded figure for tables; empty for NaN. */
    static String fixed(double v, int decimals) {
        return Double.isNaN(v) ? "" : String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    /** The page's opening: head with inline style, title, heading and the caution box. */
    static void open(StringBuilder b, String title, String heading) {
        b.append("<!DOCTYPE html>\n<html lang=\"en\" data-broken-images=\"unknown\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>").append(esc(title)).append("</title>\n<style>\n").append(STYLE)
                .append(ReviewControls.STYLE).append("</style>\n")
                .append("</head>\n<body>\n<h1>").append(esc(heading)).append("</h1>\n");
        caution(b);
    }

    /** The caution box (FleetReport.CAUTION). */
    static void caution(StringBuilder b) {
        b.append("<p class=\"caution\" role=\"note\"><strong>Caution.</strong> ").append(esc(FleetReport.CAUTION))
                .append("</p>\n");
    }

    /** The page's end: the caution again, the image check and (where tables are sortable) the sort script. */
    static void close(StringBuilder b) {
        close(b, "");
    }

    /** The page's end with one more inline script after the common one (the fleet page's review controls). */
    static void close(StringBuilder b, String moreScript) {
        b.append("<footer>\n");
        caution(b);
        b.append("<p class=\"small\">Colours: the Okabe-Ito palette for colour-blind readers (Okabe and Ito, "
                + "&quot;Color Universal Design (CUD): how to make figures and presentations that are friendly to "
                + "colorblind people&quot;, 2008). Every colour is also named in a legend or table.</p>\n");
        b.append("</footer>\n<script>\n").append(SCRIPT).append(moreScript).append("</script>\n</body>\n</html>\n");
    }

    private static final String STYLE = """
            body{font-family:"DejaVu Sans",Helvetica,Arial,sans-serif;margin:1.5em auto;max-width:1300px;padding:0 1em;\
            color:#111;line-height:1.4}
            h1{font-size:1.5em}h2{font-size:1.25em;margin-top:1.6em;border-bottom:1px solid #ccc}h3{font-size:1.08em}
            table{border-collapse:collapse;margin:.5em 0 1em}th,td{border:1px solid #bbb;padding:.2em .45em;\
            text-align:left;vertical-align:top}th{background:#eee}td.num,th.num{text-align:right}td.t{white-space:nowrap}
            .datatable td{white-space:pre-line}.datatable td.t{white-space:nowrap}
            table.sortable th{cursor:pointer}table.sortable th:after{content:" \\2195";color:#777;font-weight:normal}
            .caution{border:2px solid #D55E00;background:#fff6ef;padding:.5em .8em}
            .found{background:#e8f4fb}.missing{background:#fbe3d3;font-weight:bold}.ambiguous{background:#fdf3c4;\
            font-style:italic}.failed{color:#a03c00;font-weight:bold}
            .small{font-size:.85em;color:#444}figure{margin:.6em 0 1.2em}figcaption{font-size:.88em;color:#333;\
            max-width:60em}img{border:1px solid #ddd;max-width:100%;height:auto}
            .swatch{display:inline-block;width:.9em;height:.9em;border:1px solid #555;vertical-align:middle;\
            margin-right:.25em}
            """;

    /**
     * Inline, no library: marks the page with the number of images that failed to load (data-broken-images, read
     * by report-check.sh), and sorts tables of class "sortable" when a header is clicked (numbers by data-sort).
     * Without JavaScript the tables stay in their written order and everything else still reads.
     */
    private static final String SCRIPT = """
            window.addEventListener('load',function(){var bad=0;var im=document.images;
            for(var i=0;i<im.length;i++){if(!(im[i].complete&&im[i].naturalWidth>0)){bad++;}}
            document.documentElement.setAttribute('data-broken-images',String(bad));});
            document.querySelectorAll('table.sortable').forEach(function(t){
            t.querySelectorAll('th').forEach(function(th,col){th.addEventListener('click',function(){
            var tb=t.tBodies[0];var rows=Array.prototype.slice.call(tb.rows);
            var asc=th.getAttribute('aria-sort')!=='ascending';
            t.querySelectorAll('th').forEach(function(h){h.removeAttribute('aria-sort');});
            th.setAttribute('aria-sort',asc?'ascending':'descending');
            var key=function(r){var c=r.cells[col];var s=c.getAttribute('data-sort');
            return s!==null?parseFloat(s):c.textContent.trim().toLowerCase();};
            rows.sort(function(a,b){var x=key(a),y=key(b);var d=(x<y?-1:x>y?1:0);return asc?d:-d;});
            rows.forEach(function(r){tb.appendChild(r);});});});});
            document.querySelectorAll('div.datatable').forEach(function(box){
            var data=JSON.parse(document.getElementById(box.id+'-data').textContent);var rows=data.rows.slice();
            var per=PAGE_ROWS;var page=0;var sortCol=-1;var asc=true;
            var text=function(c){return typeof c==='string'?c:typeof c==='number'?data.strings[c]:c.t;};
            var key=function(c){if(typeof c==='object'&&c.s!==undefined){return c.s;}return text(c).toLowerCase();};
            var table=document.createElement('table');var head=table.createTHead().insertRow();
            var body=table.createTBody();var nav=document.createElement('p');nav.className='small pager';
            var prev=document.createElement('button');prev.textContent='previous';
            var next=document.createElement('button');next.textContent='next';var where=document.createElement('span');
            nav.appendChild(prev);nav.appendChild(document.createTextNode(' '));nav.appendChild(where);
            nav.appendChild(document.createTextNode(' '));nav.appendChild(next);
            var show=function(){body.textContent='';var from=page*per;var to=Math.min(rows.length,from+per);
            for(var i=from;i<to;i++){var tr=body.insertRow();rows[i].forEach(function(c,j){var td=tr.insertCell();
            if(data.columns[j].n){td.className='num';}
            if(typeof c==='object'){if(c.c){td.className=c.c;}if(c.ti){td.title=c.ti;}
            if(c.f){td.setAttribute('data-finding',c.f);}
            if(c.h){var a=document.createElement('a');a.href=c.h;a.textContent=c.t;td.appendChild(a);return;}}
            td.textContent=text(c);});}
            where.textContent='rows '+(rows.length?from+1:0)+'-'+to+' of '+rows.length;
            prev.disabled=page===0;next.disabled=to>=rows.length;nav.hidden=rows.length<=per;};
            data.columns.forEach(function(col,j){var th=document.createElement('th');th.textContent=col.t;
            if(col.n){th.className='num';}th.addEventListener('click',function(){asc=sortCol===j?!asc:true;sortCol=j;
            head.querySelectorAll('th').forEach(function(h){h.removeAttribute('aria-sort');});
            th.setAttribute('aria-sort',asc?'ascending':'descending');
            rows.sort(function(a,b){var x=key(a[j]),y=key(b[j]);var d=(x<y?-1:x>y?1:0);return asc?d:-d;});
            page=0;show();});head.appendChild(th);});
            prev.addEventListener('click',function(){page--;show();});
            next.addEventListener('click',function(){page++;show();});
            table.className='sortable';box.appendChild(table);box.appendChild(nav);show();});
            """.replace("PAGE_ROWS", Integer.toString(DataTable.PAGE_ROWS));
}
