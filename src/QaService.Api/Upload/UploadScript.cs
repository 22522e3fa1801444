using System.Security.Cryptography;
using System.Text;
using QaService.Core.Reporting.Html;

namespace QaService.Api.Upload;

/// <summary>
/// The guided upload's one inline script, an improvement only (every step works without it): live CRS suggestions
/// from <c>GET /v1/crs</c> into each CRS field's datalist, and a progress bar while the files are sent (XMLHttpRequest
/// upload progress). The page's Content-Security-Policy allows exactly this script by its SHA-256 (CSP Level 3 §8.4
/// hash-source) and same-origin requests, nothing else.
/// </summary>
internal static class UploadScript
{
    public const string Source = """
        (function(){
        "use strict";
        var timers={};
        function suggest(input){
          var list=document.getElementById(input.getAttribute("list"));
          var status=document.getElementById(input.id+"-status");
          var q=input.value.trim();
          if(q.length<2||/^EPSG:\d+$/i.test(q)&&list.querySelector("option[value='"+q.toUpperCase()+"']")){return;}
          fetch("/v1/crs?limit=8&q="+encodeURIComponent(q),{headers:{Accept:"application/json"},credentials:"same-origin"})
            .then(function(r){return r.ok?r.json():null;})
            .then(function(page){
              if(!page){return;}
              list.textContent="";
              page.items.forEach(function(c){var o=document.createElement("option");o.value=c.id;o.label=c.id+" "+c.name;o.textContent=c.name;list.appendChild(o);});
              if(status){status.textContent=page.total+" matching CRS"+(page.total===1?"":"s")+(page.total>8?"; the first 8 are suggested":"");}
            }).catch(function(){});
        }
        document.querySelectorAll("input[data-crs-suggest]").forEach(function(input){
          input.addEventListener("input",function(){clearTimeout(timers[input.id]);timers[input.id]=setTimeout(function(){suggest(input);},200);});
        });
        var form=document.getElementById("guided");
        if(!form||!window.FormData){return;}
        form.addEventListener("submit",function(e){
          var submitter=e.submitter;
          var files=form.querySelectorAll("input[type=file]");
          var bytes=0;files.forEach(function(f){if(f.files&&f.files[0]){bytes+=f.files[0].size;}});
          if(!submitter||submitter.value!=="preview"||bytes===0){return;}
          e.preventDefault();
          var box=document.getElementById("upload-progress-box");
          var bar=document.getElementById("upload-progress");
          var text=document.getElementById("upload-progress-text");
          box.hidden=false;
          var xhr=new XMLHttpRequest();
          // The buttons are named "action", which shadows form.action: read the attribute.
          var target=new URL(form.getAttribute("action"),window.location.href).href;
          xhr.open("POST",target);
          xhr.upload.addEventListener("progress",function(p){
            if(p.lengthComputable){bar.max=p.total;bar.value=p.loaded;text.textContent="Sending the files: "+Math.round(100*p.loaded/p.total)+" %";}
          });
          xhr.addEventListener("load",function(){
            text.textContent="Sent; reading the files";
            if(xhr.responseURL&&xhr.responseURL!==target){window.location.assign(xhr.responseURL);return;}
            document.open();document.write(xhr.responseText);document.close();
          });
          xhr.addEventListener("error",function(){text.textContent="The upload failed; sending the form the ordinary way";form.submit();});
          xhr.send(new FormData(form,submitter));
        });
        })();
        """;

    /// <summary>The CSP hash-source of <see cref="Source"/> (base64 of its UTF-8 SHA-256).</summary>
    public static string HashSource { get; } = $"'sha256-{Convert.ToBase64String(SHA256.HashData(Encoding.UTF8.GetBytes(Source)))}'";

    /// <summary>The pages' policy: <see cref="PageShell.ContentSecurityPolicy"/> plus this script and same-origin fetches.</summary>
    public static string ContentSecurityPolicy { get; } = $"{PageShell.ContentSecurityPolicy}; script-src {HashSource}; connect-src 'self'";

    public static string Element => $"<script>{Source}</script>";
}
