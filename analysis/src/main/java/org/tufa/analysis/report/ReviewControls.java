package org.tufa.analysis.report;

import com.google.gson.Gson;
import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import java.time.ZoneId;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Set;
import org.tufa.analysis.findings.Finding;
import org.tufa.analysis.fleet.Csv;
import org.tufa.analysis.fleet.FleetAnalysis;
import org.tufa.analysis.fleet.FleetOutputs;
import org.tufa.analysis.fleet.UnitOutcome;
import org.tufa.analysis.review.ReviewFile;
import org.tufa.analysis.review.ReviewStep;
import org.tufa.analysis.review.Verdict;

/**
 * The review controls of the fleet page: beside each finding a verdict (confirmed, rejected, not sure), a cause
 * (one of the candidate causes, or typed) and a note; above the table the reviewer's name and one button that saves
 * every verdict as {@code review.csv} ({@link ReviewFile}'s columns) for the next run's {@code --review}.
 *
 * <p>Everything happens in the page, offline: the findings and the verdicts the run already applied are embedded
 * as JSON, the verdicts are kept in the page's memory while it is open, and the file is handed to the browser as a
 * download of a local Blob (no server, no network; works from {@code file://}). Verdicts the run read that belong to
 * no listed finding (rejected findings no longer listed, verdicts that matched nothing) are written back unchanged,
 * so saving never loses a verdict. The controls are made by the script for every {@code td.review} cell, also for
 * cells added later: the findings table is drawn by the page's data-table script a page of rows at a time, and a
 * redrawn or re-sorted table keeps its verdicts (they live in the page's state, not in the cells).
 * Without JavaScript the cells show the review status as text.
 */
final class ReviewControls {

    private ReviewControls() {
    }

    /** The explanation, the reviewer's name, the save button and the embedded data; before the findings table. */
    static void toolbar(StringBuilder b, FleetAnalysis.Result result, ZoneId zone) {
        b.append("<div class=\"review-bar\" id=\"review-bar\">\n<p><strong>Review.</strong> Give each finding a "
                + "verdict once it has been checked on site: <em>confirmed</em> (a fault; name the cause), "
                + "<em>rejected</em> (normal operation: the next run does not flag this period and signature "
                + "again) or <em>not sure</em>. Verdicts stay in this page while it is open; "
                + "<strong>save them</strong> as <code>review.csv</code> and pass the file to the next run "
                + "(<code>tufa analyze ... --review review.csv</code>). Nothing is sent anywhere.</p>\n"
                + "<noscript><p>The verdict controls need JavaScript; without it, write review.csv by hand (columns "
                + ReviewFile.HEADER + ").</p></noscript>\n"
                + "<p><label>Reviewer <input type=\"text\" id=\"review-reviewer\" size=\"24\" autocomplete=\"name\">"
                + "</label> <button type=\"button\" id=\"review-save\">Save review file (review.csv)</button> "
                + "<span id=\"review-status\" class=\"small\" role=\"status\"></span></p>\n</div>\n");
        b.append("<script type=\"application/json\" id=\"review-data\">").append(data(result, zone))
                .append("</script>\n");
    }

    /** The review cell of one finding's row (its status as text until the script puts the controls in). */
    static String cell(UnitOutcome u, Finding f, ZoneId zone) {
        ReviewStep.Mark mark = u.mark(f);
        return "<td class=\"review\" data-finding=\"" + mark.findingId() + "\">" + status(mark, zone) + "</td>";
    }

    /** A finding's review status in words, escaped: its own verdict and cause, the other verdicts overlapping it. */
    static String status(ReviewStep.Mark mark, ZoneId zone) {
        StringBuilder s = new StringBuilder();
        if (mark.own() != null) {
            s.append("<strong>").append(Html.esc(mark.own().decision().word().replace('_', ' '))).append("</strong>");
            if (!mark.own().cause().isEmpty()) {
                s.append(": ").append(Html.esc(mark.own().cause()));
            }
            s.append(" <span class=\"small\">(review ").append(Html.esc(mark.own().where())).append(")</span>");
        }
        if (!mark.overlapping().isEmpty()) {
            s.append(s.length() == 0 ? "" : "<br>").append("<span class=\"small\">overlaps ")
                    .append(Html.esc(FleetOutputs.overlaps(mark, zone))).append("</span>");
        }
        return s.toString();
    }

    /** The same status as plain text (for a data table's cell, which is inserted as text). */
    static String statusText(ReviewStep.Mark mark, ZoneId zone) {
        StringBuilder s = new StringBuilder();
        if (mark.own() != null) {
            s.append(mark.own().decision().word().replace('_', ' '));
            if (!mark.own().cause().isEmpty()) {
                s.append(": ").append(mark.own().cause());
            }
            s.append(" (review ").append(mark.own().where()).append(")");
        }
        if (!mark.overlapping().isEmpty()) {
            s.append(s.length() == 0 ? "" : "\n").append("overlaps ").append(FleetOutputs.overlaps(mark, zone));
        }
        return s.toString();
    }

    /** The findings, their verdicts and the verdicts to carry over, as JSON safe inside a script element. */
    static String data(FleetAnalysis.Result result, ZoneId zone) {
        JsonObject root = new JsonObject();
        root.addProperty("header", ReviewFile.HEADER);
        JsonArray findings = new JsonArray();
        Set<Verdict> own = Collections.newSetFromMap(new IdentityHashMap<>());
        for (UnitOutcome u : result.units()) {
            for (Finding f : u.findings()) {
                ReviewStep.Mark mark = u.mark(f);
                JsonObject j = new JsonObject();
                j.addProperty("id", mark.findingId());
                j.addProperty("unit", u.unit());
                j.addProperty("mode", f.mode());
                j.addProperty("kind", f.kind());
                j.addProperty("start", Csv.time(f.start(), zone));
                j.addProperty("end", Csv.time(f.end(), zone));
                JsonArray causes = new JsonArray();
                f.causes().forEach(causes::add);
                j.add("causes", causes);
                if (mark.own() != null) {
                    own.add(mark.own());
                    j.add("verdict", verdict(mark.own(), zone));
                }
                findings.add(j);
            }
        }
        root.add("findings", findings);
        JsonArray carried = new JsonArray();
        for (Verdict v : result.review().verdicts()) {
            if (!own.contains(v)) {
                carried.add(verdict(v, zone));
            }
        }
        root.add("carried", carried);
        // Gson's default escaping writes < > & = ' as \\u003c ...: no "</script>" can end the element early.
        return new Gson().toJson(root);
    }

    private static JsonObject verdict(Verdict v, ZoneId zone) {
        JsonObject j = new JsonObject();
        j.addProperty("unit", v.unit());
        j.addProperty("mode", v.mode());
        j.addProperty("kind", v.kind());
        j.addProperty("start", Csv.time(v.start(), zone));
        j.addProperty("end", Csv.time(v.end(), zone));
        j.addProperty("finding_id", v.findingId());
        j.addProperty("verdict", v.decision().word());
        j.addProperty("cause", v.cause());
        j.addProperty("note", v.note());
        j.addProperty("reviewer", v.reviewer());
        j.addProperty("date", v.date() == null ? "" : v.date().toString());
        return j;
    }

    static final String STYLE = """
            .review-bar{border:1px solid #0072B2;background:#eef6fb;padding:.3em .8em;margin:.6em 0}
            td.review{min-width:16em}td.review label{white-space:nowrap;margin-right:.5em}
            td.review input[type=text]{width:100%;box-sizing:border-box;margin-top:.2em}
            tr.v-confirmed td{background:#fbe3d3}tr.v-rejected td{background:#eeeeee;color:#555}
            tr.v-not_sure td{background:#fdf3c4}
            """;

    /**
     * The page's review script (no library). State: one entry per finding id, filled from the embedded verdicts;
     * every control writes to it (events are caught on the document, so rows drawn later work too). Findings of two
     * channels of the same cluster episode share an id ({@code FindingIds}: unit, mode, kind, start), so they share
     * one verdict: an edit in one row shows in the other. Saving writes the review file's rows: every finding id
     * with a verdict, once, in the table's original order, then the carried ones.
     * Text cells a spreadsheet would run as a formula get a leading apostrophe and cells with a comma, quote or line
     * break are quoted, as tufa's own CSV writer does.
     */
    static final String SCRIPT = """
            (function(){var el=document.getElementById('review-data');if(!el){return;}
            var data=JSON.parse(el.textContent);var byId={};var state={};var dirty=0;var cells=0;
            data.findings.forEach(function(f){byId[f.id]=f;var v=f.verdict;
            state[f.id]=v?{verdict:v.verdict,cause:v.cause,note:v.note,reviewer:v.reviewer,date:v.date,changed:false}
            :{verdict:'',cause:'',note:'',reviewer:'',date:'',changed:false};});
            var words=[['confirmed','confirmed'],['rejected','rejected'],['not_sure','not sure'],['','no verdict']];
            function today(){var d=new Date();function p(n){return(n<10?'0':'')+n;}
            return d.getFullYear()+'-'+p(d.getMonth()+1)+'-'+p(d.getDate());}
            function paint(td){var tr=td.parentNode;var s=state[td.getAttribute('data-finding')];
            ['v-confirmed','v-rejected','v-not_sure'].forEach(function(c){tr.classList.remove(c);});
            if(s.verdict){tr.classList.add('v-'+s.verdict);}}
            function build(td){var id=td.getAttribute('data-finding');var f=byId[id];var s=state[id];
            if(!f||td.getAttribute('data-ready')){return;}td.setAttribute('data-ready','1');td.textContent='';cells++;
            var group=document.createElement('div');group.setAttribute('role','radiogroup');
            group.setAttribute('aria-label','verdict');
            words.forEach(function(w){var l=document.createElement('label');var r=document.createElement('input');
            r.type='radio';r.name='verdict-'+id+'-'+cells;r.value=w[0];r.className='review-verdict';r.checked=(s.verdict===w[0]);
            l.appendChild(r);l.appendChild(document.createTextNode(' '+w[1]));group.appendChild(l);});
            td.appendChild(group);var list=document.createElement('datalist');list.id='causes-'+id;
            f.causes.forEach(function(c){var o=document.createElement('option');o.value=c;list.appendChild(o);});
            td.appendChild(list);var cause=document.createElement('input');cause.type='text';
            cause.className='review-cause';cause.setAttribute('list',list.id);
            cause.placeholder='cause (choose from the candidates or type)';cause.value=s.cause;td.appendChild(cause);
            var note=document.createElement('input');note.type='text';note.className='review-note';
            note.placeholder='note';note.value=s.note;td.appendChild(note);paint(td);}
            function buildAll(root){(root.querySelectorAll?root:document).querySelectorAll('td.review[data-finding]')
            .forEach(build);}
            function count(){var n=0;Object.keys(state).forEach(function(k){if(state[k].verdict){n++;}});
            document.getElementById('review-status').textContent=n+' of '+data.findings.length
            +' finding(s) with a verdict'+(dirty?'; '+dirty+' change(s) not saved yet':'')
            +(data.carried.length?'; '+data.carried.length+' earlier verdict(s) kept as they are':'');}
            function edit(ev){var t=ev.target;var td=t.closest?t.closest('td.review[data-finding]'):null;
            if(!td){return;}var s=state[td.getAttribute('data-finding')];
            if(t.classList.contains('review-verdict')){if(!t.checked){return;}s.verdict=t.value;}
            else if(t.classList.contains('review-cause')){s.cause=t.value;}
            else if(t.classList.contains('review-note')){s.note=t.value;}else{return;}
            s.changed=true;dirty++;sync(td);count();}
            function sync(td){var id=td.getAttribute('data-finding');var s=state[id];
            document.querySelectorAll('td.review[data-finding]').forEach(function(o){
            if(o.getAttribute('data-finding')!==id){return;}
            o.querySelectorAll('input.review-verdict').forEach(function(r){r.checked=(r.value===s.verdict);});
            var c=o.querySelector('input.review-cause');if(c&&c!==document.activeElement){c.value=s.cause;}
            var n=o.querySelector('input.review-note');if(n&&n!==document.activeElement){n.value=s.note;}paint(o);});}
            document.addEventListener('change',edit);document.addEventListener('input',function(ev){
            if(ev.target.type==='text'){edit(ev);}});
            function cell(t){t=t==null?'':String(t);if(/^[=+\\-@\\t\\r]/.test(t)){t="'"+t;}
            return /[",\\n\\r]/.test(t)?'"'+t.replace(/"/g,'""')+'"':t;}
            function row(r){return [cell(r.unit),r.mode,r.kind,r.start,r.end,r.finding_id,r.verdict,cell(r.cause),
            cell(r.note),cell(r.reviewer),r.date].join(',');}
            function save(){var who=document.getElementById('review-reviewer').value.trim();var lines=[data.header];
            var written={};data.findings.forEach(function(f){var s=state[f.id];if(!s.verdict||written[f.id]){return;}
            written[f.id]=1;
            if(s.changed){s.reviewer=who;s.date=today();s.changed=false;}
            lines.push(row({unit:f.unit,mode:f.mode,kind:f.kind,start:f.start,end:f.end,finding_id:f.id,
            verdict:s.verdict,cause:s.cause.trim(),note:s.note.trim(),reviewer:s.reviewer,date:s.date}));});
            data.carried.forEach(function(v){lines.push(row(v));});
            var blob=new Blob([lines.join('\\n')+'\\n'],{type:'text/csv;charset=utf-8'});
            var a=document.createElement('a');a.href=URL.createObjectURL(blob);a.download='review.csv';
            document.body.appendChild(a);a.click();document.body.removeChild(a);
            setTimeout(function(){URL.revokeObjectURL(a.href);},60000);dirty=0;count();}
            document.getElementById('review-save').addEventListener('click',save);
            window.addEventListener('beforeunload',function(ev){if(dirty){ev.preventDefault();ev.returnValue='';}});
            buildAll(document);new MutationObserver(function(ms){ms.forEach(function(m){m.addedNodes.forEach(
            function(n){if(n.nodeType===1){if(n.matches&&n.matches('td.review[data-finding]')){build(n);}
            else{buildAll(n);}}});});}).observe(document.body,{childList:true,subtree:true});count();})();
            """;
}
