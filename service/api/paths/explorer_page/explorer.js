// Starts Swagger UI on the explorer page (/docs). It lives in its own file so that the page's
// content-security policy needs no inline script. The OpenAPI document's address is the page's
// data-document attribute, relative to the page, so the page also works behind a path prefix.
(function () {
  "use strict";
  var root = document.getElementById("explorer");
  window.ui = SwaggerUIBundle({
    url: new URL(root.getAttribute("data-document"), document.baseURI).href,
    domNode: root,
    presets: [SwaggerUIBundle.presets.apis],
    layout: "BaseLayout",
    deepLinking: true,
    displayRequestDuration: true,
    validatorUrl: null
  });
})();
